// framewise page: read the form, ask the wasm kernel, write the drawing and the tables.
// Every number and every word about a number comes from Rust; this file only wires the DOM.
import * as wasm from './pkg/framewise.js';
import { buildForm, readForm, clearMessages, showErrors, showNotes, setField, showFilled } from './ui/form.js';
import { renderResults, wireDefinitions, sentence } from './ui/results.js';
import { attachZoom } from './ui/zoom.js';
import { attachView, getView, applyView } from './ui/view.js';
import { attachChart } from './ui/chart.js'; // its wasm module loads on the first paste
import { initShare } from './ui/share.js'; // share links (issue 6)
import { registerOffline } from './ui/offline.js'; // offline use (issue 6)
import { createPainter } from './ui/onscreen.js';
import { createDrawingWriter } from './ui/drawing.js';
import { createStrip } from './ui/strip.js';
import { explainLabels } from './ui/labels.js';

// The module's path from this file: the built site bundles this file with the glue (scripts/site.mjs).
await wasm.default({ module_or_path: new URL('./pkg/framewise_bg.wasm', import.meta.url) });

const words = JSON.parse(wasm.page_words_json());
const catalogue = JSON.parse(wasm.catalogue_json());
const definitions = new Map([
  ...catalogue.map((m) => [m.key, m]),
  ...words.terms.map((t) => [t.key, t]),
]);

const form = document.getElementById('bike-form');
const drawing = document.getElementById('drawing');
const status = document.getElementById('status');
const results = document.getElementById('results');

buildForm(form, words);
const painter = createPainter(); // on-screen parts at once, the rest in the next task
painter.watch(drawing);
attachView(drawing);
const zoom = attachZoom(drawing, document.getElementById('fit-view'));
const showDrawing = createDrawingWriter(drawing, wasm, zoom); // web/ui/drawing.js
wireDefinitions(results, definitions);
explainLabels(drawing, document.getElementById('drawing-def'), definitions); // the drawing's numbers
const strip = document.getElementById('strip');
const showStrip = createStrip(strip, definitions, new Map(words.short_labels), form); // key numbers on a phone
painter.watch(strip); // hidden at a desk and unless a field is being typed in: written when shown

// A posture whose figure the kernel left out (a limb out of reach) is drawn without its rider
// (and without its centre of mass, so its handling numbers have none): its reasons (the kernel's
// "unreachable" warnings, which start with the posture) are said under the drawing while that
// posture is shown, not only in the warnings list. A figure drawn with some numbers left out (a
// pedal out of reach at one crank angle) is said in the warnings list only.
const postureNote = document.getElementById('posture-note');
const standingBox = document.getElementById('posture-standing');
let lastBike = null;
function showPostureNote(bike = lastBike) {
  lastBike = bike;
  const posture = standingBox.checked ? 'standing' : 'seated';
  if (bike?.handling?.[posture]?.com_x_mm != null) { // drawn: the usual case, nothing written
    if (!postureNote.hidden) postureNote.hidden = true;
    return;
  }
  const why = (bike?.warnings ?? [])
    .filter((w) => w.code === 'unreachable' && w.message.startsWith(posture))
    .map((w) => sentence(w.message))
    .join(' ');
  if (postureNote.textContent !== why) postureNote.textContent = why;
  if (postureNote.hidden !== !why) postureNote.hidden = !why;
}

// The form's text: an input event updates its field; code that fills the form resets it.
let typed = null;
const formFields = () => (typed ??= readForm(form)); // share.fields() copies it
// The number of the form the wasm module holds (wasm.page_form_seq(); 0: none): an edit of one
// field sends only that field (crates/web/src/edit.rs). Code that fills the form resets it.
let heldForm = 0;

// Fills the form from a shared link; returns the link's field names the form has no input for.
function writeForm(fields) {
  typed = null;
  heldForm = 0;
  for (const c of form.elements) if (c.name) c.value = fields[c.name] ?? (c.tagName === 'SELECT' ? c.options[0]?.value ?? '' : '');
  showFilled(form);
  return Object.keys(fields).filter((name) => !form.elements.namedItem(name));
}

let asking = false; // the frame numbers were cleared and the listing has not read since

// A new listing starts blank: the demo's frame numbers (some under "More frame numbers") would
// otherwise be read with the person's own and could disagree with them.
const clearFrame = document.createElement('button');
clearFrame.type = 'button';
clearFrame.className = 'tool clear-frame';
clearFrame.textContent = 'Clear frame and fork numbers';
form.querySelector('.group-frame .group-hint')?.after(clearFrame);
clearFrame.addEventListener('click', () => {
  for (const c of form.elements) if (c.name === 'label' || c.name?.startsWith('frame.')) c.value = '';
  typed = null;
  heldForm = 0;
  asking = true;
  showFilled(form);
  update();
  form.elements.namedItem('frame.reach_mm')?.focus();
});

// Share links (issue 6): opens a link in the address before the first drawing.
// A link pasted into the open page's address is evaluated at once.
const share = initShare({ getFields: formFields, applyFields: writeForm, getView, applyView, opened: () => update() });

// A problem with the field being typed in waits for this pause (or for the field to be left).
const TYPING_PAUSE_MS = 800;
let problemsLater = 0;
let sayProblems = null; // the waiting problems' writer
form.addEventListener('focusout', () => {
  clearTimeout(problemsLater);
  sayProblems?.();
});

// A problem in a sentence that names its field (its label, unless the message has it).
const labels = new Map(words.fields.map((f) => [f.name, f.label]));
function named(problem) {
  if (!problem) return '';
  const label = labels.get(problem.field);
  const text = sentence(problem.message);
  return label && !text.toLowerCase().includes(label.toLowerCase()) ? `${label}: ${text}` : text;
}

// A frame length typed with its own unit ("47,5 cm", "18.7in") is said in mm beside its field
// (the box's unit reads mm): the published value as the kernel read it.
function unitNotes(bike) {
  const fields = formFields();
  return Object.entries(bike.residuals ?? {})
    .filter(([key]) => key.endsWith('_mm') && /[a-z"'″]/i.test(fields[`frame.${key}`]?.replace(/mm\s*$/i, '')))
    .map(([key, r]) => ({ field: `frame.${key}`, message: `Read as ${+r.given.toFixed(1)} mm.` }));
}

// Returns what the page now shows: { shown: true } when the edit was drawn, else
// { shown: false, problem } with the first problem in a sentence (the chart box says it).
function update(event) {
  const typedIn = event?.target;
  const oneField = typed && typedIn?.name && typedIn.form === form;
  if (typedIn?.form === form) showFilled(form, typedIn);
  if (oneField) typed[typedIn.name] = typedIn.value;
  // One wasm call reads the form once for the tables, the drawing (made when written) and the
  // share link (made once typing pauses): the edited field of the form it holds, or the whole
  // form (share.fields(): the form plus values of an opened link that have no input here).
  const view = JSON.stringify(share.view());
  let answer = oneField && heldForm ? wasm.evaluate_field_page(heldForm, typedIn.name, typedIn.value, view) : 'null';
  if (answer === 'null') {
    answer = wasm.evaluate_form_page(JSON.stringify(share.fields()), view);
    heldForm = wasm.page_form_seq();
  }
  const result = JSON.parse(answer);
  clearTimeout(problemsLater);
  sayProblems = null;
  clearMessages();
  if (result.field_notes) showNotes(form, result.field_notes); // lengths read in cm or inches
  const errors = result.field_errors ?? [];
  if (errors.length || !result.report.bikes?.length) {
    const problems = errors.length ? errors : result.report.errors ?? [];
    // The status under the drawing names the fields in error, each a link to its box.
    const fieldLinks = (lead, tail) => {
      const names = [...new Set(problems.map((e) => e.field))].filter((n) => labels.has(n));
      const links = names.map((n) => Object.assign(document.createElement('a'), { href: `#${form.elements.namedItem(n)?.id}`, textContent: labels.get(n) }));
      status.replaceChildren(lead, ...(links.length ? links.flatMap((a, i) => (i ? [', ', a] : [a])) : ['the marked field']), tail);
    };
    // A listing cleared to start again: its blank fields are asked for under the drawing, not
    // marked, until the listing reads.
    const blank = (e) => form.elements.namedItem(e.field)?.value.trim() === '';
    const asked = asking && errors.some(blank);
    const show = () => {
      sayProblems = null;
      const unplaced = showErrors(form, asked ? problems.filter((e) => !blank(e)) : problems);
      if (unplaced.length) status.textContent = unplaced.join(' ');
      else if (asked) fieldLinks('Type the listing\'s numbers, at least ', '; until then the drawing and numbers show the last good bike.');
      else fieldLinks('Fix ', '; the drawing and numbers show the last good values.');
    };
    // A number half typed ("4" of "470") is said only after a pause in typing, or when the
    // person leaves the field; any other problem at once. The last good result stays meanwhile.
    const typing = oneField && errors.length && errors.every((e) => e.field === typedIn.name || (asked && blank(e)));
    if (typing) {
      sayProblems = show;
      problemsLater = setTimeout(show, TYPING_PAUSE_MS);
    } else show();
    return { shown: false, problem: named(problems[0]) };
  }
  asking = false;
  if (status.textContent) status.textContent = '';
  showNotes(form, unitNotes(result.report.bikes[0]));
  // The tables, then the drawing (made when written); neither reads a place from the page.
  renderResults(results, result.report.bikes[0], result.notes, catalogue, definitions, painter);
  const bike = result.report.bikes[0];
  painter.paint(strip, () => showStrip(bike));
  showPostureNote(result.report.bikes[0]);
  painter.paint(drawing, showDrawing);
  share.update(wasm.last_link); // the address follows the page once typing pauses
  return { shown: true };
}

function applySize(size) {
  typed = null;
  heldForm = 0;
  for (const f of words.fields) {
    const key = f.name.startsWith('frame.') ? f.name.slice(6) : null;
    // The importer's text keeps each value's rounding ("99 cm", "65"); the number is a fallback.
    if (key) setField(form, f.name, size.text?.[key] ?? (size.frame?.[key] != null ? String(size.frame[key]) : ''));
  }
  for (const end of ['front', 'rear']) {
    const w = size.wheels?.[end];
    if (typeof w === 'string') setField(form, `wheels.${end}`, w);
  }
  if (size.label) setField(form, 'label', `Chart size ${size.label}`);
  showFilled(form);
  const field = (name) => form.elements.namedItem(name)?.value ?? '';
  return { ...update(), wheels: [field('wheels.front'), field('wheels.rear')] };
}

attachChart(document.getElementById('chart'), applySize);

// Rehearsal: V8 runs a wasm function unoptimised until it has run a while, so a person's first
// edits would each take about twice as long as later ones. Once the page is drawn, the kernel
// rehearses an edit of the loaded form in idle time (a few ms at a time, paused while the tab
// is hidden; then <html data-rehearsed>): wasm.rehearse changes nothing the page shows
// (crates/web/src/rehearse.rs; tests/browser/drawing-patch.test.mjs).
const REHEARSALS = 150;
const whenIdle = window.requestIdleCallback ?? ((run) => setTimeout(() => run({ timeRemaining: () => 4 }), 50));
function rehearse(left) {
  const fields = JSON.stringify(share.fields());
  const view = JSON.stringify(share.view());
  whenIdle(function step(deadline) {
    if (document.hidden) {
      document.addEventListener('visibilitychange', () => whenIdle(step), { once: true });
      return;
    }
    while (left > 0 && deadline.timeRemaining() > 2) {
      wasm.rehearse(fields, view);
      left -= 1;
    }
    if (left > 0) whenIdle(step);
    else document.documentElement.dataset.rehearsed = 'true';
  });
}

form.addEventListener('input', update);
// A view choice evaluates the form again: its link is of the last form the page showed, with the
// new view (a link made of the form as typed could hold a field in error). The posture note
// follows the posture shown even while a field is in error (the last good bike is drawn).
document.addEventListener('framewise:view', () => {
  update();
  showPostureNote();
});
update();
registerOffline();
document.documentElement.dataset.ready = 'true';
rehearse(REHEARSALS);
