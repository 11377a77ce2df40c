// The paste box: geometry chart text → the importer in wasm → a size run; picking a size fills
// the frame and wheel fields. Rows the importer did not recognise, its questions and its notes
// are listed, never dropped.
// The importer lives in the on-demand module (ui/extras.js) and the box's writer in
// ui/chart-read.js, both loaded on the first paste or "Read the chart".
import { loadExtras } from './extras.js';
import { sentence } from './results.js';

let reader = null;

/** ui/chart-read.js: one load shared by every caller; a failed load is forgotten. */
function loadReader() {
  // From the page's address, and not bundled: the first view does not need it.
  reader ??= import(new URL('ui/chart-read.js', document.baseURI).href).catch((e) => { reader = null; throw e; });
  return reader;
}

function say(out, cls, text, role) {
  const p = document.createElement('p');
  p.className = cls;
  if (role) p.setAttribute('role', role);
  p.textContent = text;
  out.replaceChildren(p);
}

/**
 * Wires the paste box. `apply(size)` fills the form from `{label, frame, wheels}`,
 * recomputes and says what the page shows (ui/chart-read.js pickedText). The importer
 * (`import_chart_with_answers(text, answersJson) → JSON text`) and the writer are loaded on the
 * first paste or press of "Read the chart".
 */
export function attachChart(section, apply) {
  section.hidden = false;
  const text = section.querySelector('#chart-text');
  const out = section.querySelector('#chart-out');
  const button = section.querySelector('#chart-read');
  const state = { answers: {}, picked: null };
  let importChart = null;
  let showRun = null;
  async function load() {
    if (importChart) return true;
    say(out, 'chart-loading', 'Loading the chart reader…');
    button.disabled = true;
    try {
      const [extras, ui] = await Promise.all([loadExtras(), loadReader()]);
      importChart = extras.import_chart_with_answers;
      showRun = ui.showRun;
      return true;
    } catch {
      say(out, 'chart-error', 'The chart reader could not be loaded. Check the connection and press "Read the chart" again.', 'alert');
      return false;
    } finally {
      button.disabled = false;
    }
  }
  function read() {
    showRun(out, JSON.parse(importChart(text.value, JSON.stringify(state.answers))), state, apply, read, sentence);
  }
  function start() {
    state.answers = {};
    state.picked = null;
    if (importChart) read(); // once loaded, the chart is read at once, in the same task
    else load().then((ok) => { if (ok) read(); });
  }
  // A paste is read as soon as it is in the box; typed changes wait for the button. Either way
  // the sizes, questions and notes of the text before are taken away at once, so a size button
  // never applies a chart that is no longer in the box.
  let pasted = false;
  text.addEventListener('paste', () => {
    pasted = true;
    loadExtras().catch(() => {});
    loadReader().catch(() => {});
  });
  text.addEventListener('input', () => {
    if (pasted) {
      pasted = false;
      start();
      return;
    }
    state.answers = {};
    state.picked = null;
    if (out.childElementCount) say(out, 'chart-none', 'The text changed: press "Read the chart" to read it.');
  });
  button.addEventListener('click', start);
}
