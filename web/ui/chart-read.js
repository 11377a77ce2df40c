// The chart reader's answer written into the paste box (ui/chart.js): the sizes to pick, what
// picking one did, rows not recognised, questions and notes. Loaded with the on-demand module on
// the first read, so the first view never requests it; it imports nothing (the built site bundles
// app.js and its modules into one file, which this file cannot import from).

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

function questionList(questions, answers, reread, sentence) {
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
    const said = (outcome?.problem || 'a value is refused').trim();
    const problem = /[.!?]$/.test(said) ? said : `${said}.`;
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
 * Writes one reading into `out`: `run` is the importer's answer (parsed JSON); `state` holds
 * { answers, picked } across readings (ui/chart.js); apply(size) fills the form and says what
 * the page shows (app.js applySize); reread() reads the chart again (a question answered);
 * sentence: a message as a sentence (ui/results.js).
 */
export function showRun(out, run, state, apply, reread, sentence) {
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
      const b = el('button', { type: 'button', class: 'size', 'aria-pressed': String(s.label === state.picked), 'data-size': s.label }, s.label || `Size ${i + 1}`);
      b.addEventListener('click', () => {
        state.picked = s.label;
        for (const o of group.children) o.setAttribute('aria-pressed', String(o === b));
        pick(s, i);
      });
      group.append(b);
    });
    parts.push(el('p', { class: 'chart-count' }, `${sizes.length} size${sizes.length > 1 ? 's' : ''} read; pick one to fill in the frame numbers.`), group, said);
    const again = sizes.findIndex((s) => s.label === state.picked);
    if (again >= 0) pick(sizes[again], again);
  } else if (!run.error) {
    parts.push(el('p', { class: 'chart-none' }, 'No sizes could be read from this text.'));
  }
  parts.push(list('Rows not recognised (not used)', run.unrecognised, 'chart-unrecognised'));
  parts.push(questionList(run.questions, state.answers, reread, sentence));
  // A note about one row is shown after its label; a note about the whole chart, or said once
  // for several rows (`rows`, which its message names), as a sentence.
  parts.push(list('Notes', run.notes?.map((n) => (n.row ? `${n.row}: ${n.message}` : sentence(n.message))), 'chart-notes'));
  out.replaceChildren(...parts.filter(Boolean));
}
