// The input form, built from the page's words (crates/formats/src/fields.rs): one fieldset per
// group, the common fields shown, the rest under a "more" disclosure. Reads the typed text and
// places each error message beside its field.

function el(tag, props = {}, ...children) {
  const node = document.createElement(tag);
  for (const [k, v] of Object.entries(props)) {
    if (k === 'class') node.className = v;
    else if (k in node && k !== 'list') node[k] = v;
    else node.setAttribute(k, v);
  }
  node.append(...children);
  return node;
}

function idFor(name) {
  return `f-${name.replace(/[^a-z0-9]+/gi, '-')}`;
}

function control(f, id) {
  if (f.kind === 'choice') {
    const select = el('select', { id, name: f.name });
    for (const c of f.choices) select.append(el('option', { value: c, selected: c === f.demo }, c));
    return select;
  }
  const numeric = !['text', 'wheel'].includes(f.kind);
  return el('input', {
    id, name: f.name, value: f.demo, autocomplete: 'off', autocapitalize: 'off',
    spellcheck: false, inputMode: numeric ? 'decimal' : 'text',
    class: f.kind === 'text' ? 'wide' : '',
  });
}

function fieldRow(f) {
  const id = idFor(f.name);
  const input = control(f, id);
  input.setAttribute('aria-describedby', `${id}-def`);
  // A text box sits in its own block (`.box`, styled with containment in style.css), so that
  // typing re-lays out the box alone and not the form around it.
  return el('div', { class: `field kind-${f.kind}` },
    el('label', { htmlFor: id }, f.label),
    input.tagName === 'INPUT' ? el('span', { class: 'box' }, input) : input,
    el('span', { class: 'unit', 'aria-hidden': 'true' }, f.unit),
    el('p', { class: 'def', id: `${id}-def` }, f.definition),
    el('p', { class: 'msg', id: `${id}-msg`, role: 'alert' }));
}

/** Fills the form element from the words' groups and fields. */
export function buildForm(form, words) {
  for (const g of words.groups) {
    const fields = words.fields.filter((f) => f.group === g.id);
    const common = fields.filter((f) => f.common).map(fieldRow);
    const rest = fields.filter((f) => !f.common).map(fieldRow);
    const set = el('fieldset', { class: `card group group-${g.id}` },
      el('legend', {}, g.title), el('p', { class: 'group-hint' }, g.hint), ...common);
    if (rest.length) {
      const more = el('details', { class: 'more' }, el('summary', {}), ...rest);
      more.dataset.title = `More ${g.title.toLowerCase()}`;
      set.append(more);
    }
    form.append(set);
  }
  showFilled(form);
}

/**
 * Each "more" disclosure's summary says how many fields it has and how many of its text boxes
 * hold a value, so a value hidden under it is never a surprise. `target`: the edited control
 * (only its disclosure is counted again), or none (all of them).
 */
export function showFilled(form, target) {
  const list = target ? [target.closest?.('details.more')].filter(Boolean) : form.querySelectorAll('details.more');
  for (const d of list) {
    const fields = d.querySelectorAll('input, select');
    const filled = [...d.querySelectorAll('input')].filter((i) => i.value.trim()).length;
    const text = `${d.dataset.title} (${fields.length}${filled ? `, ${filled} filled` : ''})`;
    const summary = d.querySelector('summary');
    if (summary.textContent !== text) summary.textContent = text;
  }
}

/** `{ field name: typed text }` for every named control. */
export function readForm(form) {
  const fields = {};
  for (const c of form.elements) if (c.name) fields[c.name] = c.value;
  return fields;
}

function msgFor(control) {
  return document.getElementById(`${control.id}-msg`);
}

// The controls showErrors marked: clearing them needs no search of the form on every edit.
const marked = new Set();
let stale = null; // the messages an edit cleared and has not written again (see clearMessages)

/**
 * Clears every message and invalid mark: those the same edit writes again (showErrors,
 * showNotes) are left as they are, the rest cleared once it is done (a microtask), so a note that
 * stands across edits costs no layout of the form on each one.
 */
export function clearMessages() {
  if (!stale) queueMicrotask(settle);
  stale = new Set([...(stale ?? []), ...marked]);
  marked.clear();
}

function settle() {
  for (const c of stale ?? []) write(c, '', false, false);
  stale = null;
}

/** Sets a field's message (only what changed); `note`: not an error. */
function write(c, text, note, invalid) {
  const m = msgFor(c);
  if (!m) return false;
  if (m.textContent !== text) m.textContent = text;
  m.classList.toggle('note', note);
  const described = text ? `${m.id} ${c.id}-def` : `${c.id}-def`;
  if (c.getAttribute('aria-describedby') !== described) c.setAttribute('aria-describedby', described);
  if (invalid) c.setAttribute('aria-invalid', 'true');
  else if (c.hasAttribute('aria-invalid')) c.removeAttribute('aria-invalid');
  if (text) {
    marked.add(c);
    stale?.delete(c);
  }
  return true;
}

/** Puts each error beside its field; returns the messages that have no field on the form. */
export function showErrors(form, errors) {
  const unplaced = [];
  for (const e of errors) {
    const c = form.elements.namedItem(e.field);
    if (!c || !write(c, e.message, false, true)) { unplaced.push(e.message); continue; }
    const more = c.closest('details');
    if (more) more.open = true;
  }
  return unplaced;
}

/** Puts each note (a length read in cm or inches) beside its field, not marked as an error. */
export function showNotes(form, notes) {
  for (const n of notes) {
    const c = form.elements.namedItem(n.field);
    if (c) write(c, n.message, true, false);
  }
}

/** Sets a field's text (used by the chart paste box). */
export function setField(form, name, text) {
  const c = form.elements.namedItem(name);
  if (c) c.value = text;
}
