// The paste box: geometry chart text → the importer in wasm → a size run; picking a size fills
// the frame and wheel fields. Rows the importer did not recognise, its questions and its notes
// are listed, never dropped.
// The importer lives in the on-demand module (ui/extras.js), loaded on the first paste or
// "Read the chart".
import { loadExtras } from './extras.js';
import { sentence } from './results.js';

function el(tag, props = {}, ...children) {
  const node = document.createElement(tag);
  for (const [k, v] of Object.entries(props)) {
    if (k === 'class') node.className = v;
    else if (k.startsWith('data-') || k.startsWith('aria-')) node.setAttribute(k, v);
    else node[k] = v;
  }
  node.append(...children);
  return node;
}


function list(title, items, cls) {
  if (!items?.length) return null;
  const text = (i) => (typeof i === 'string' ? i : i.message ?? i.label ?? JSON.stringify(i));
  return el('div', { class: cls }, el('h3', {}, title), el('ul', {}, ...items.map((i) => el('li', {}, text(i)))));
}

function questionList(questions, answers, reread) {
  if (!questions?.length) return null;
  const items = questions.map((q, i) => {
    const id = `chart-q-${i}`;
    const select = el('select', { id });
    for (const o of q.options ?? []) select.append(el('option', { value: o, selected: o === q.chosen }, o));
    select.addEventListener('change', () => { answers[q.id] = select.value; reread(); });
    return el('li', { class: 'question' }, el('label', { htmlFor: id }, sentence(q.message)), select);
  });
  return el('div', { class: 'chart-questions' }, el('h3', {}, 'Questions'), el('ul', {}, ...items));
}

/**
 * What picking a size did, in a sentence: `outcome` is apply()'s answer ({ shown, problem,
 * wheels: [front, rear] as now in the form }). A chart without wheel sizes keeps the form's.
 */
function pickedText(size, name, outcome) {
  const count = Object.keys(size.frame ?? {}).length;
  const filled = `Size ${name}: ${count} frame number${count === 1 ? '' : 's'} filled in.`;
  if (!outcome?.shown) {
    const problem = (outcome?.problem || 'a value is refused').trim().replace(/(?<![.!?])$/, '.');
    return `${filled} It could not be drawn: ${problem} The marked field in the form says what to check.`;
  }
  const [front, rear] = outcome.wheels ?? [];
  const given = typeof size.wheels?.front === 'string' || typeof size.wheels?.rear === 'string';
  const kept = front === rear ? front : `${front} front, ${rear} rear`;
  return given || !front
    ? `${filled} The drawing and the numbers show it.`
    : `${filled} The chart gives no wheel size, so the wheels in the form (${kept}) are kept; change them under Wheels and fork if this bike has others.`;
}

/**
 * Wires the paste box. `apply(size)` fills the form from `{label, frame, wheels}`,
 * recomputes and says what the page shows (see pickedText). The importer (`import_chart_with_answers(text, answersJson) → JSON text`) is
 * loaded on the first paste or press of "Read the chart".
 */
export function attachChart(section, apply) {
  section.hidden = false;
  const text = section.querySelector('#chart-text');
  const out = section.querySelector('#chart-out');
  const button = section.querySelector('#chart-read');
  let answers = {};
  let picked = null;
  let importChart = null;
  async function load() {
    if (importChart) return true;
    out.replaceChildren(el('p', { class: 'chart-loading' }, 'Loading the chart reader…'));
    button.disabled = true;
    try {
      importChart = (await loadExtras()).import_chart_with_answers;
      return true;
    } catch {
      out.replaceChildren(el('p', { class: 'chart-error', role: 'alert' },
        'The chart reader could not be loaded. Check the connection and press "Read the chart" again.'));
      return false;
    } finally {
      button.disabled = false;
    }
  }
  function read() {
    const run = JSON.parse(importChart(text.value, JSON.stringify(answers)));
    const sizes = run.sizes ?? [];
    const parts = [];
    if (run.error) parts.push(el('p', { class: 'chart-error', role: 'alert' }, run.error.message));
    if (sizes.length) {
      const group = el('div', { class: 'sizes', role: 'group', 'aria-label': 'Sizes in the chart' });
      const said = el('p', { class: 'chart-picked', role: 'status' });
      const pick = (s, i) => {
        const outcome = apply(s);
        said.textContent = pickedText(s, s.label || String(i + 1), outcome);
        said.classList.toggle('chart-error', !outcome?.shown);
      };
      sizes.forEach((s, i) => {
        const b = el('button', { type: 'button', class: 'size', 'aria-pressed': String(s.label === picked), 'data-size': s.label }, s.label || `Size ${i + 1}`);
        b.addEventListener('click', () => {
          picked = s.label;
          for (const o of group.children) o.setAttribute('aria-pressed', String(o === b));
          pick(s, i);
        });
        group.append(b);
      });
      parts.push(el('p', { class: 'chart-count' }, `${sizes.length} size${sizes.length > 1 ? 's' : ''} read; pick one to fill in the frame numbers.`), group, said);
      const again = sizes.findIndex((s) => s.label === picked);
      if (again >= 0) pick(sizes[again], again);
    } else if (!run.error) {
      parts.push(el('p', { class: 'chart-none' }, 'No sizes could be read from this text.'));
    }
    parts.push(list('Rows not recognised (not used)', run.unrecognised, 'chart-unrecognised'));
    parts.push(questionList(run.questions, answers, read));
    // A note about one row is shown after its label; a note about the whole chart, or said once
    // for several rows (`rows`, which its message names), as a sentence.
    parts.push(list('Notes', run.notes?.map((n) => (n.row ? `${n.row}: ${n.message}` : sentence(n.message))), 'chart-notes'));
    out.replaceChildren(...parts.filter(Boolean));
  }
  function start() {
    answers = {};
    picked = null;
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
  });
  text.addEventListener('input', () => {
    if (pasted) {
      pasted = false;
      start();
      return;
    }
    answers = {};
    picked = null;
    if (out.childElementCount) {
      out.replaceChildren(el('p', { class: 'chart-none' }, 'The text changed: press "Read the chart" to read it.'));
    }
  });
  button.addEventListener('click', start);
}
