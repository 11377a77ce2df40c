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

/** A message as a sentence: its first letter in capitals (also ui/chart.js, app.js). */
export const sentence = (t) => (t ? t.charAt(0).toUpperCase() + t.slice(1) : t);

function el(tag, props = {}, ...children) {
  const node = document.createElement(tag);
  for (const [k, v] of Object.entries(props)) {
    if (k === 'class') node.className = v;
    else if (k.startsWith('data-') || k.startsWith('aria-') || k === 'colspan' || k === 'scope' || k === 'role') node.setAttribute(k, v);
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
  });
  const unit = unitOf(key)[1];
  if (unit.length > 1) btn.append(label, el('span', { class: 'u' }, unit));
  else if (!unit) btn.append(label);
  else {
    // A sign (° or %) wraps with the name's last word: alone on a line it reads as belonging to
    // nothing. A unit in letters (mm) may take a line of its own, so a short name stays whole.
    const cut = label.lastIndexOf(' ') + 1;
    btn.append(label.slice(0, cut), el('span', { class: 'last' }, label.slice(cut), el('span', { class: 'u' }, unit)));
  }
  return [btn];
}

function defRow(key, words, span) {
  const t = words.get(key);
  return el('tr', { class: 'def-row', 'data-def-for': key, role: 'row' },
    el('td', { colspan: String(span), role: 'cell' }, t?.definition ?? 'No definition recorded for this number yet.'));
}

// The results as data first: blocks of tables and lists, each made (and its cells formatted)
// only when the painter writes it. A block that keeps its shape only gets its changed texts.

function numberKeys(obj) {
  return Object.keys(obj ?? {}).filter((k) => typeof obj[k] === 'number');
}

const FRAME_CAPTION = 'Frame: published, solved and as ridden';

function frameBlock(bike, notes, catalogue) {
  const rows = catalogue.map(({ key }) => {
    const r = bike.residuals[key];
    const bad = r && !r.consistent;
    return {
      key,
      cls: `${r ? 'given' : ''}${bad ? ' inconsistent' : ''}`,
      get cells() {
        return [
          ['given', r ? format(key, r.given) : '–'], // a disagreeing value's ⚠ is by its name (style.css)
          ['stock', format(key, bike.stock[key])],
          ['ridden', format(key, bike.ridden[key])],
        ];
      },
      note: notes[key],
    };
  });
  return { type: 'table', caption: FRAME_CAPTION, cols: ['Measure', 'Published', 'Solved', 'Ridden'], rows };
}

function simpleBlock(caption, obj) {
  const keys = numberKeys(obj);
  if (!keys.length) return null;
  return { type: 'table', caption, cols: ['Measure', 'Value'], rows: keys.map((key) => ({ key, cls: '', get cells() { return [['value', format(key, obj[key])]]; } })) };
}

function postureBlock(caption, block) {
  // A column only for a case with numbers: the report's point-load case is empty unless a load
  // was given (the page has no input for one).
  const cols = Object.keys(block ?? {}).filter((c) => block[c] && typeof block[c] === 'object' && numberKeys(block[c]).length);
  const keys = [...new Set(cols.flatMap((c) => numberKeys(block[c])))];
  if (!keys.length) return null;
  return {
    type: 'table', caption, cols: ['Measure', ...cols.map(sentence)],
    rows: keys.map((key) => ({ key, cls: '', get cells() { return cols.map((c) => [c, format(key, block[c][key])]); } })),
  };
}

/** Which table a ridden number that is not a frame measurement goes in, by its key. */
function partOf(key) {
  if (/^(saddle|post|dropper|seat)_/.test(key)) return 'saddle';
  if (/^(pedal|toe)_/.test(key)) return 'ground';
  return 'cockpit';
}

/** The catalogue's frame keys (the cockpit tables show the other ridden numbers). */
const frameKeys = new WeakMap();

/** Whether a posture block (columns of numbers) has any number. */
function hasPostureNumbers(block) {
  return Object.values(block ?? {}).some((c) => c && typeof c === 'object' && numberKeys(c).length);
}

/** The result blocks as [id, make] in page order; make() builds the block when written. */
function model(bike, notes, catalogue) {
  if (!frameKeys.has(catalogue)) frameKeys.set(catalogue, new Set(catalogue.map((m) => m.key)));
  const isFrame = frameKeys.get(catalogue);
  // The ridden numbers that are not frame measurements, in three tables by what they are about
  // (one pass over the report's numbers: this runs on every edit).
  const byPart = { cockpit: null, saddle: null, ground: null };
  for (const k in bike.ridden) {
    const v = bike.ridden[k];
    if (typeof v !== 'number' || isFrame.has(k)) continue;
    (byPart[partOf(k)] ??= {})[k] = v;
  }
  const ridden = (part) => byPart[part];
  const hasRidden = (part) => byPart[part] !== null;
  const table = (caption, make) => [`table|${caption}`, () => make(caption)];
  return [
    bike.warnings?.length && ['warnings', () => ({
      type: 'warnings',
      items: bike.warnings.map((w) => ({
        cls: w.code.startsWith('caution') ? 'caution' : w.code === 'inconsistent' ? 'inconsistent' : 'note', text: sentence(w.message),
      })),
    })],
    bike.missing?.length && ['missing', () => ({ type: 'missing', keys: bike.missing })],
    table(FRAME_CAPTION, () => frameBlock(bike, notes, catalogue)),
    hasRidden('cockpit') && table('Cockpit, as ridden', (c) => simpleBlock(c, ridden('cockpit'))),
    hasRidden('saddle') && table('Saddle and seatpost, as ridden', (c) => simpleBlock(c, ridden('saddle'))),
    hasRidden('ground') && table('Pedals and toes', (c) => simpleBlock(c, ridden('ground'))),
    hasPostureNumbers(bike.fit) && table('Fit', (c) => postureBlock(c, bike.fit)),
    hasPostureNumbers(bike.handling) && table('Handling', (c) => postureBlock(c, bike.handling)),
    numberKeys(bike.derived).length && table('Steering', (c) => simpleBlock(c, bike.derived)),
    bike.checks?.length && ['checks', () => ({
      type: 'checks',
      items: bike.checks.map((c) => ({ cls: c.within === false ? 'outside' : 'inside', text: c.message, source: c.source })),
    })],
  ].filter(Boolean);
}

/** A block's identity: which table or list it is. */
function idOf(b) {
  return b.type === 'table' ? `table|${b.caption}` : b.type;
}

/** A block's shape: what its nodes are (rows, columns, notes, items), not what they say. */
function shapeOf(b) {
  // Joined with a control character no caption, key or class holds (cheaper than JSON on every edit).
  if (b.type !== 'table') return [b.type, ...(b.keys ?? b.items.map((i) => i.cls))].join('\u0001');
  let s = `${b.caption}\u0001${b.cols.join('\u0001')}`;
  for (const r of b.rows) s += `\u0001${r.key}${r.note ? '\u0002' : ''}`;
  return s;
}

/** A row's changeable values in render order: class, cell texts, note. */
function rowValues(r) {
  const out = [r.cls, ...r.cells.map((c) => c[1])];
  if (r.note) out.push(r.note);
  return out;
}

/** A list's changeable values: each item's class, text and source. */
function itemValues(b) {
  return b.items ? b.items.flatMap((i) => [i.cls, i.text, i.source ?? '']) : [];
}

/** rows: gets { first, last, refs } per row (first and last <tr>, its values' nodes). */
function buildTable(b, words, rows) {
  const scope = b.caption.split(':')[0];
  // The CSS lays rows out as flex lines (style.css), which can drop a table's native semantics in
  // some browsers, so every part also carries its table role.
  const head = el('tr', { role: 'row' }, ...b.cols.map((c, i) => el('th', { scope: 'col', role: 'columnheader', class: i ? 'num' : '' }, c)));
  const body = el('tbody', { role: 'rowgroup' });
  for (const r of b.rows) {
    // Each number in a box of its own (span.v) that Chromium lays out alone (style.css).
    const boxes = r.cells.map(([, text]) => el('span', { class: 'v' }, text));
    const tds = r.cells.map(([col], i) => el('td', { 'data-col': col, class: 'num', role: 'cell' }, boxes[i]));
    const tr = el('tr', { 'data-key': r.key, class: r.cls, role: 'row', title: words.get(r.key)?.definition ?? '' }, el('th', { scope: 'row', role: 'rowheader' }, ...term(r.key, scope, words)), ...tds);
    const row = { first: tr, last: tr, refs: [[tr, 'class'], ...boxes.map((box) => [box, 'text'])] };
    body.append(tr);
    if (r.note) {
      const td = el('td', { colspan: String(b.cols.length), role: 'cell' }, r.note);
      row.refs.push([td, 'text']);
      row.last = el('tr', { class: 'note-row', role: 'row' }, td);
      body.append(row.last);
    }
    rows.push(row);
    if (open.has(`${scope}|${r.key}`)) body.append(defRow(r.key, words, b.cols.length));
  }
  // A table of one or two value columns gives its names more of the row (on a phone, a name of
  // two lines rather than three).
  const cls = b.cols.length === 2 ? 'numbers one-value' : b.cols.length === 3 ? 'numbers two-values' : 'numbers';
  return el('table', { class: cls, role: 'table' }, el('caption', {}, b.caption), el('thead', { role: 'rowgroup' }, head), body);
}

function buildItems(b, refs) {
  const main = el('ul');
  const minor = el('ul');
  for (const i of b.items) {
    const text = el('span', { class: 'item-text' }, i.text);
    const source = el('small', { class: 'source' }, i.source ? `Source: ${i.source}` : '');
    const li = b.type === 'checks'
      ? el('li', { class: i.cls }, el('span', { class: 'check-mark', 'aria-hidden': 'true' }), el('span', {}, text, ' ', source))
      : el('li', { class: i.cls }, text);
    refs.push([li, 'class'], [text, 'text'], [source, b.type === 'checks' ? 'source' : 'none']);
    (b.type === 'warnings' && i.cls === 'note' ? minor : main).append(li);
  }
  const title = b.type === 'checks' ? 'Fit and safety checks' : 'Warnings and cautions';
  const box = el('div', { class: b.type, id: b.type }); // places the strip links to (ui/strip.js)
  if (main.children.length) box.append(el('h3', {}, title), main);
  if (minor.children.length) {
    box.append(el('details', { class: 'notes' },
      el('summary', {}, `Assumptions and notes (${minor.children.length})`), minor));
  }
  return box;
}

// The kernel's list together fixes the frame (crates/kernel solve/plan.rs `suggest`: each one
// fixes one more part), so all of them are asked for.
function buildMissing(b, words) {
  const names = b.keys.map((k) => words.get(k)?.label ?? k);
  return el('div', { class: 'missing', role: 'note' },
    el('h3', {}, 'Missing measurements'),
    el('p', {}, `Nothing given fixes part of the frame. Add ${names.length > 1 ? 'these' : 'this'} from the listing: `,
      el('strong', {}, names.join(', ')), '.'));
}

let rebuildAll = true; // set when the tables' rows were changed by hand (definitions)
let parts = []; // one per block: { id, shape, node, refs (lists), rows (tables), rest (a queue key) }

function build(b, words) {
  const refs = [];
  const rows = [];
  const node = b.type === 'table' ? buildTable(b, words, rows)
    : b.type === 'missing' ? buildMissing(b, words) : buildItems(b, refs);
  watchRows(rows);
  return { id: idOf(b), shape: shapeOf(b), node, refs, rows, rest: {} };
}

/** Sets a node's text, changing its one text node in place where it has one (cheaper layout). */
function setText(node, text) {
  const t = node.firstChild;
  if (t && t === node.lastChild && t.nodeType === Node.TEXT_NODE) {
    if (t.data !== text) t.data = text;
  } else if (node.textContent !== text) {
    node.textContent = text;
  }
}

/** Writes one block's values into its nodes, touching only what changed. */
function patch(refs, vals) {
  vals.forEach((v, i) => {
    const [node, kind] = refs[i];
    if (kind === 'class') { if (node.className !== v) node.className = v; }
    else if (kind === 'text') setText(node, v);
    else if (kind === 'source') setText(node, v ? `Source: ${v}` : '');
  });
}

// Which table rows are away from the screen, as of the last frame (an IntersectionObserver, as
// the painter's for blocks; a row not yet reported counts as on the screen, as a new block
// does): reading row places in the handler would force a style and layout pass before anything
// is written, and the page lays out again after the writes anyway.
const rowsAway = new WeakSet();
const rowWatch = new IntersectionObserver((entries) => {
  for (const e of entries) {
    if (e.isIntersecting) rowsAway.delete(e.target); else rowsAway.add(e.target);
  }
});

function watchRows(rows) {
  for (const r of rows) {
    rowWatch.observe(r.first);
    if (r.last !== r.first) rowWatch.observe(r.last);
  }
}

function forgetRows(rows) {
  for (const r of rows) {
    rowWatch.unobserve(r.first);
    if (r.last !== r.first) rowWatch.unobserve(r.last);
  }
}

/** Whether any of a row's lines was on the screen at the last frame (or is not yet reported). */
function rowSeen(r) {
  return !rowsAway.has(r.first) || !rowsAway.has(r.last);
}

/** Writes a table of unchanged shape: the rows `shown` (flags) now, the rest in the next task. */
function patchTable(part, b, shown, painter) {
  const now = (i) => !shown || shown[i];
  b.rows.forEach((r, i) => { if (now(i)) patch(part.rows[i].refs, rowValues(r)); });
  if (!shown || shown.every(Boolean)) { painter.forget(part.rest); return; } // drop an older rest
  painter.later(part.rest, () => {
    b.rows.forEach((r, i) => { if (!now(i)) patch(part.rows[i].refs, rowValues(r)); });
  });
}

/**
 * Renders every table and list for one bike into the container. A block that keeps its shape
 * (same rows, same columns, same notes, same kinds of items) only gets its changed texts and
 * classes; a block whose shape changed is rebuilt alone; a new list of blocks rebuilds them all.
 * Every write goes through `painter` (ui/onscreen.js): at once for a block on the screen, else
 * in the next task.
 */
export function renderResults(container, bike, notes, catalogue, words, painter, queued = false) {
  // No block on the screen: the whole render waits for the next task.
  if (!queued && parts.length && !rebuildAll && parts.every((p) => !painter.onScreen(p.node))) {
    painter.later(container, () => renderResults(container, bike, notes, catalogue, words, painter, true));
    return;
  }
  painter.forget(container); // drop an older queued render
  const blocks = model(bike, notes ?? {}, catalogue);
  const sameList = !rebuildAll && blocks.length === parts.length
    && blocks.every(([id], i) => id === parts[i].id);
  if (!sameList) {
    for (const p of parts) {
      painter.forget(p.node);
      painter.forget(p.rest);
      forgetRows(p.rows);
    }
    parts = blocks.map(([, make]) => build(make(), words));
    for (const p of parts) painter.watch(p.node);
    container.replaceChildren(...parts.map((p) => p.node));
    rebuildAll = false;
    return;
  }
  // Each block is compared, formatted and written when the painter writes it: at once on the
  // screen, in the next task off it. A later edit's write for the same node replaces a queued one.
  const shown = parts.map((p) => (!queued && p.rows.length && painter.onScreen(p.node) ? p.rows.map(rowSeen) : null));
  blocks.forEach(([, make], i) => {
    const part = parts[i];
    const write = (now) => {
      const b = make();
      if (shapeOf(b) === part.shape) {
        if (b.type === 'table') patchTable(part, b, now ? shown[i] : null, painter);
        else patch(part.refs, itemValues(b));
        return;
      }
      const fresh = build(b, words);
      parts[i] = fresh;
      painter.forget(part.node);
      painter.forget(part.rest);
      forgetRows(part.rows);
      part.node.replaceWith(fresh.node);
      painter.watch(fresh.node);
    };
    if (queued) write(false); else painter.paint(part.node, write);
  });
}

/** Tapping a name shows or hides its definition row (the state survives re-rendering). */
export function wireDefinitions(container, words) {
  container.addEventListener('click', (ev) => {
    // A tap on a row's number explains it as a tap on its name does.
    const btn = ev.target.closest('button.term') ?? ev.target.closest('tr[data-key]')?.querySelector('button.term');
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
    rebuildAll = true;
  });
}
