// The result tables: published against solved and as ridden, missing measurements, cockpit,
// steering, fit and handling, warnings. Every label and definition comes from the catalogue and
// the glossary (Rust); this file only lays them out. Tapping or hovering a name explains it.

const open = new Set(); // keys whose definition row is shown

const UNIT = [['_mm', 'mm', 1], ['_deg', '°', 1], ['_pct', '%', 0], ['_kg', 'kg', 1], ['_g', 'g', 2]];

function unitOf(key) {
  return UNIT.find(([s]) => key.endsWith(s)) ?? ['', '', 1];
}

/** A number to the key's precision (its unit is shown with the name); never NaN. */
export function format(key, v) {
  if (typeof v !== 'number' || !Number.isFinite(v)) return '–';
  return v.toFixed(unitOf(key)[2]).replace('-', '−');
}

function el(tag, props = {}, ...children) {
  const node = document.createElement(tag);
  for (const [k, v] of Object.entries(props)) {
    if (k === 'class') node.className = v;
    else if (k.startsWith('data-') || k.startsWith('aria-') || k === 'colspan' || k === 'scope') node.setAttribute(k, v);
    else node[k] = v;
  }
  node.append(...children);
  return node;
}

function term(key, scope, words) {
  const t = words.get(key);
  const label = t?.label ?? key.replace(/_(mm|deg|pct|kg|g)$/, '').replaceAll('_', ' ');
  const btn = el('button', {
    type: 'button', class: 'term', title: t?.definition ?? '', 'aria-expanded': String(open.has(`${scope}|${key}`)),
    'data-term': key, 'data-scope': scope,
  }, label);
  const unit = unitOf(key)[1];
  return unit ? [btn, el('span', { class: 'u' }, unit)] : [btn];
}

function defRow(key, words, span) {
  const t = words.get(key);
  return el('tr', { class: 'def-row', 'data-def-for': key },
    el('td', { colspan: String(span) }, t?.definition ?? 'No definition recorded for this number yet.'));
}

function table(caption, cols, rows, words, extraRow) {
  const scope = caption.split(':')[0];
  const head = el('tr', {}, ...cols.map((c, i) => el('th', { scope: 'col', class: i ? 'num' : '' }, c)));
  const body = el('tbody');
  for (const { key, cells, cls = '' } of rows) {
    const tr = el('tr', { 'data-key': key, class: cls },
      el('th', { scope: 'row' }, ...term(key, scope, words)),
      ...cells.map(([col, text]) => el('td', { 'data-col': col, class: 'num' }, text)));
    body.append(tr);
    const extra = extraRow?.(key);
    if (extra) body.append(el('tr', { class: 'note-row' }, el('td', { colspan: String(cols.length) }, extra)));
    if (open.has(`${scope}|${key}`)) body.append(defRow(key, words, cols.length));
  }
  return el('table', { class: 'numbers' }, el('caption', {}, caption), el('thead', {}, head), body);
}

function numberKeys(obj) {
  return Object.keys(obj ?? {}).filter((k) => typeof obj[k] === 'number');
}

function frameTable(bike, notes, catalogue, words) {
  const rows = catalogue.map(({ key }) => {
    const r = bike.residuals[key];
    const bad = r && !r.consistent;
    return {
      key,
      cls: `${r ? 'given' : ''} ${bad ? 'inconsistent' : ''}`,
      cells: [
        ['given', r ? `${bad ? '⚠ ' : ''}${format(key, r.given)}` : '–'],
        ['stock', format(key, bike.stock[key])],
        ['ridden', format(key, bike.ridden[key])],
      ],
    };
  });
  return table('Frame: published, solved and as ridden', ['Measure', 'Published', 'Solved', 'Ridden'],
    rows, words, (key) => notes[key]);
}

function simpleTable(caption, obj, words) {
  const keys = numberKeys(obj);
  if (!keys.length) return null;
  return table(caption, ['Measure', 'Value'], keys.map((key) => ({ key, cells: [['value', format(key, obj[key])]] })), words);
}

function postureTable(caption, block, words) {
  const cols = Object.keys(block ?? {}).filter((c) => block[c] && typeof block[c] === 'object');
  const keys = [...new Set(cols.flatMap((c) => numberKeys(block[c])))];
  if (!keys.length) return null;
  const title = (c) => c.charAt(0).toUpperCase() + c.slice(1);
  return table(caption, ['Measure', ...cols.map(title)],
    keys.map((key) => ({ key, cells: cols.map((c) => [c, format(key, block[c][key])]) })), words);
}

function missingList(bike, words) {
  if (!bike.missing?.length) return null;
  const names = bike.missing.map((k) => words.get(k)?.label ?? k);
  return el('div', { class: 'missing', role: 'note' },
    el('h3', {}, 'Missing measurements'),
    el('p', {}, 'Nothing given fixes part of the frame. Add any one of these from the listing: ',
      el('strong', {}, names.join(', ')), '.'));
}

function warningList(bike) {
  if (!bike.warnings?.length) return null;
  const items = bike.warnings.map((w) => el('li', {
    class: w.code.startsWith('caution') ? 'caution' : w.code === 'inconsistent' ? 'inconsistent' : 'note',
  }, w.message));
  return el('div', { class: 'warnings' }, el('h3', {}, 'Warnings and cautions'), el('ul', {}, ...items));
}

function checkList(bike) {
  if (!bike.checks?.length) return null;
  const items = bike.checks.map((c) => el('li', { class: c.within === false ? 'outside' : 'inside' },
    el('span', { class: 'check-mark', 'aria-hidden': 'true' }, c.within === false ? '!' : '✓'),
    el('span', {}, c.message, ' ', el('small', { class: 'source' }, `Source: ${c.source}`))));
  return el('div', { class: 'checks' }, el('h3', {}, 'Fit and safety checks'), el('ul', {}, ...items));
}

/** Renders every table for one bike into the container. */
export function renderResults(container, bike, notes, catalogue, words) {
  const ridden = Object.fromEntries(Object.entries(bike.ridden).filter(([k]) => !catalogue.some((m) => m.key === k)));
  const parts = [
    warningList(bike),
    missingList(bike, words),
    frameTable(bike, notes ?? {}, catalogue, words),
    simpleTable('Cockpit and saddle, as ridden', ridden, words),
    postureTable('Fit', bike.fit, words),
    postureTable('Handling', bike.handling, words),
    simpleTable('Steering', bike.derived, words),
    checkList(bike),
  ].filter(Boolean);
  container.replaceChildren(...parts);
}

/** Tapping a name shows or hides its definition row (the state survives re-rendering). */
export function wireDefinitions(container, words) {
  container.addEventListener('click', (ev) => {
    const btn = ev.target.closest('button.term');
    if (!btn) return;
    const key = btn.dataset.term;
    const id = `${btn.dataset.scope}|${key}`;
    const row = btn.closest('tr');
    const shown = open.has(id);
    if (shown) open.delete(id); else open.add(id);
    btn.setAttribute('aria-expanded', String(!shown));
    const next = row.nextElementSibling?.classList.contains('note-row') ? row.nextElementSibling : row;
    const existing = row.parentElement.querySelector(`tr.def-row[data-def-for="${key}"]`);
    if (shown) existing?.remove();
    else next.after(defRow(key, words, row.children.length));
  });
}
