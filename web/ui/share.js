// Share links (issue 6): the address follows the page, a copy button, the system share sheet
// where the browser has one, a QR code of the link, and opening a link fills the page.
// Every encoding and decoding is done in Rust (crates/web/src/link.rs); this file only moves text.
// Text from a link is only ever written with .value / .textContent, never as markup.
// The QR encoder is in the on-demand module (pkg/framewise_extras), loaded on the first
// "Show QR code"; the first view never requests it.
import { link_from_form, form_from_link } from '../pkg/framewise.js';
import { loadExtras } from './extras.js';

const byId = (id) => document.getElementById(id);

/** The pause in typing after which the address follows the page, ms. */
export const ADDRESS_PAUSE_MS = 300;

/** Session storage: the link the page had still to write when it went away (see pagehide). */
const RELOAD_KEY = 'framewise-address-to-write';

/** A reload within the pause: the address the page had still to write replaces the one loaded. */
function keptForReload() {
  try {
    const kept = JSON.parse(sessionStorage.getItem(RELOAD_KEY) ?? 'null');
    sessionStorage.removeItem(RELOAD_KEY);
    if (kept?.from === location.hash && typeof kept.to === 'string' && kept.to.startsWith('#')) {
      history.replaceState(history.state, '', kept.to);
    }
  } catch {
    // Unreadable or refused storage: the address as loaded.
  }
}

/**
 * Wires the share area. Call once after the wasm module is initialised and before the first
 * evaluation. Options:
 *   getFields()        → { "<field name>": "<typed text>" } of the form
 *   applyFields(f)     fills the form from a link; returns the names it has no field for
 *   getView()/applyView(v)  the page's view choices (optional; kept from the link otherwise)
 *   opened()           called after a link pasted into the address of the open page filled it
 *                      (the page evaluates the new form; the first link is opened before that)
 * Returns { fields(), view(), update(link) }: fields() is the form plus the opened link's
 * values the form has no input for (evaluate these, so the drawing shows the whole link); view()
 * the view choices for the link; call update(link) after every evaluation that succeeded, with
 * the link fragment (null when none), a function that makes it (wasm last_link, the link of the
 * last form that read: called once typing pauses, for the latest edit only; empty text when
 * none), or update() to compute it now.
 */
export function initShare({ getFields, applyFields, getView, applyView = () => {}, opened = () => {} }) {
  const msg = byId('share-msg');
  const url = byId('share-url');
  const copy = byId('share-copy');
  const native = byId('share-native');
  const qrToggle = byId('share-qr-toggle');
  const qr = byId('share-qr');
  let view = {};
  // Values of an opened link that the form has no input for: carried into the next links.
  let carried = {};
  // Until the person edits something, the address keeps the link that was opened (good or bad):
  // nothing it holds is dropped and a bad link stays for them to look at.
  let hold = false;

  const say = (text, kind = 'info') => {
    msg.textContent = text;
    msg.dataset.kind = kind;
  };

  // A jump link's target (#results-title…) is a place on the page, not a share link.
  const isPlace = (hash) => Boolean(document.getElementById(hash.slice(1)));

  // A link that cannot be opened is also said under the drawing, where a person looks first:
  // what is drawn is not what was shared. The first edit takes it away.
  const problem = byId('link-problem');
  function warnUnderDrawing(text) {
    if (!problem) return;
    problem.textContent = text;
    problem.hidden = !text;
  }

  // first: the link the page was opened with (it shows the demo bike), else one pasted later.
  function open(hash, first) {
    if (!hash || hash === '#' || isPlace(hash)) return;
    let result;
    try {
      result = JSON.parse(form_from_link(hash));
    } catch (e) {
      hold = true;
      say(`This link could not be opened: ${e.message ?? e}. The page shows its last numbers instead.`, 'bad');
      const why = String(e.message ?? e).replace(/\.$/, '');
      warnUnderDrawing(`The shared link could not be opened: ${why}. ${first
        ? 'These are the demo bike\'s numbers, not the shared ones.'
        : 'The page still shows the numbers from before, not the shared ones.'}`);
      return;
    }
    warnUnderDrawing('');
    hold = true;
    view = result.view ?? {};
    const unplaced = applyFields(result.fields) ?? [];
    carried = Object.fromEntries(unplaced.map((name) => [name, result.fields[name]]));
    applyView(view);
    const left = [...(result.omitted ?? []), ...unplaced];
    say(left.length
      ? `Opened the shared link. This page does not show ${left.length} of its values yet (${left.join(', ')}).`
      : 'Opened the shared link.', left.length ? 'note' : 'info');
  }

  function currentView() {
    return getView ? getView() : view;
  }

  let qrSvg = null;
  async function showQr() {
    addressNow();
    if (!qrSvg) {
      const loading = document.createElement('p');
      loading.textContent = 'Loading the QR code…';
      qr.replaceChildren(loading);
      try {
        qrSvg = (await loadExtras()).qr_svg;
      } catch {
        qr.replaceChildren();
        shown(false);
        say('The QR code could not be loaded. Check the connection and press "Show QR code" again.', 'bad');
        return;
      }
      if (qr.hidden) return;
    }
    try {
      const doc = new DOMParser().parseFromString(qrSvg(location.href), 'image/svg+xml');
      qr.replaceChildren(document.importNode(doc.documentElement, true));
    } catch (e) {
      qr.replaceChildren();
      say(`No QR code: ${e.message ?? e}`, 'bad');
    }
  }

  function fields() {
    return { ...carried, ...getFields() };
  }

  function update(link) {
    if (hold) {
      url.value = location.href;
      return;
    }
    let hash = link;
    if (hash === undefined) {
      try {
        hash = link_from_form(JSON.stringify(fields()), JSON.stringify(currentView()));
      } catch {
        hash = null;
      }
    }
    if (typeof hash !== 'string' && typeof hash !== 'function') {
      url.value = location.href; // a field does not read: the address keeps the last good link
      return;
    }
    // The address (history.replaceState: about 2 ms even on a fast machine, and work in the
    // browser's own process), the link box (a text box's value costs a layout of about 1 ms) and
    // the QR code follow once typing pauses, after the edit's drawing and tables are written:
    // a run of keystrokes writes the address once. Whatever reads the address (copy, the share
    // sheet, the QR code, the link box, leaving the page) brings it up to date first.
    // One timer for a run of edits: each edit moves the time it is due, and a timer that fires
    // early waits the rest (a timer set and cleared on every edit costs more, and posts work
    // across the browser's threads while the edit is being drawn).
    pending = hash;
    due = performance.now() + ADDRESS_PAUSE_MS;
    if (!timer) timer = setTimeout(whenDue, ADDRESS_PAUSE_MS);
  }

  let pending = null;
  let timer = 0;
  let due = 0;
  function whenDue() {
    const left = due - performance.now();
    if (left > 1) timer = setTimeout(whenDue, left);
    else flush();
  }
  function addressNow() {
    if (!timer) return;
    clearTimeout(timer);
    flush();
  }
  function flush() {
    timer = 0;
    let hash = pending;
    pending = null;
    if (hash === null || hold) return;
    if (typeof hash === 'function') hash = hash();
    if (!hash) {
      url.value = location.href; // no link for this form: the address keeps the last good link
      return;
    }
    if (hash !== location.hash) history.replaceState(history.state, '', hash);
    if (url.value !== location.href) url.value = location.href;
    if (!qr.hidden) showQr();
  }

  copy.addEventListener('click', async () => {
    addressNow();
    url.value = location.href;
    try {
      await navigator.clipboard.writeText(location.href);
      say('Link copied.');
    } catch {
      url.focus();
      url.select();
      say('Select the link above and copy it.');
    }
  });

  if (typeof navigator.share === 'function') {
    native.hidden = false;
    native.addEventListener('click', () => {
      addressNow();
      navigator.share({ title: document.title, url: location.href }).catch(() => {});
    });
  }

  function shown(show) {
    qr.hidden = !show;
    qrToggle.setAttribute('aria-expanded', String(show));
    qrToggle.textContent = show ? 'Hide QR code' : 'Show QR code';
  }
  qrToggle.addEventListener('click', () => {
    const show = qr.hidden;
    shown(show);
    if (show) showQr();
  });

  url.addEventListener('focus', addressNow);
  document.addEventListener('visibilitychange', () => { if (document.hidden) addressNow(); });
  // A jump link adds a history entry with the address as it is: the edit goes in first, or Back
  // would return to the form before it.
  document.addEventListener('click', (e) => { if (e.target.closest?.('a[href^="#"]')) addressNow(); }, { capture: true });
  // A reload reloads the address the browser has: one written while the page goes away is not
  // used. So the page going away keeps the link it still had to write, for this tab's next load
  // of the same address (keptForReload, below).
  window.addEventListener('pagehide', () => {
    const from = location.hash;
    addressNow();
    if (location.hash === from) return;
    try {
      sessionStorage.setItem(RELOAD_KEY, JSON.stringify({ from, to: location.hash }));
    } catch {
      // No session storage (a private mode may refuse it): a reload in the pause loses the edit.
    }
  });

  // The first edit lets the address follow the page again.
  // A message about the link shown before ("Link copied.", "Opened the shared link.", a bad
  // link) no longer describes the page once it is edited.
  document.addEventListener('input', () => {
    if (msg.dataset.kind === 'bad' || msg.dataset.kind === 'info') say('');
    if (problem && !problem.hidden) warnUnderDrawing('');
    hold = false;
  }, { capture: true });
  // A link pasted into the address bar of an open page.
  window.addEventListener('hashchange', (e) => {
    if (isPlace(location.hash)) {
      // A jump link only scrolls: the address keeps the share link (copy and share use it).
      const before = new URL(e.oldURL).hash;
      if (before && !isPlace(before)) history.replaceState(history.state, '', before);
      return;
    }
    open(location.hash, false);
    opened();
  });
  // The same link pasted into the address as the address still shows, within the pause after an
  // edit (the link from before the edit): no hashchange, since the address does not change, so
  // the edit waiting to be written would replace the pasted link. The Navigation API's event
  // (Chromium; where there is none, the edit wins) says a person asked for it: the link is opened
  // and the waiting edit dropped. The page's own writes are not asked by a person.
  globalThis.navigation?.addEventListener('navigate', (e) => {
    if (!timer || !e.userInitiated || !['push', 'replace'].includes(e.navigationType)) return;
    const to = new URL(e.destination.url);
    if (to.href !== location.href || isPlace(to.hash)) return;
    clearTimeout(timer);
    timer = 0;
    pending = null;
    open(to.hash, false);
    opened();
  });

  keptForReload();
  open(location.hash, true);
  url.value = location.href;
  return { fields, view: currentView, update };
}
