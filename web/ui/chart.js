// The paste box: geometry chart text → the importer in wasm → a size run; picking a size fills
// the frame and wheel fields. Rows the importer did not recognise, its questions and its notes
// are listed, never dropped.

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

/**
 * Wires the paste box. `importChart(text) → JSON text` is the wasm binding; `apply(size)` fills
 * the form from `{label, frame, wheels}` and recomputes.
 */
export function attachChart(section, importChart, apply) {
  section.hidden = false;
  const text = section.querySelector('#chart-text');
  const out = section.querySelector('#chart-out');
  section.querySelector('#chart-read').addEventListener('click', () => {
    const run = JSON.parse(importChart(text.value));
    const sizes = run.sizes ?? [];
    const parts = [];
    if (sizes.length) {
      const group = el('div', { class: 'sizes', role: 'radiogroup', 'aria-label': 'Sizes in the chart' });
      sizes.forEach((s, i) => {
        const b = el('button', { type: 'button', class: 'size', role: 'radio', 'aria-checked': 'false', 'data-size': String(i) }, s.label || `Size ${i + 1}`);
        b.addEventListener('click', () => {
          for (const o of group.children) o.setAttribute('aria-checked', String(o === b));
          apply(s);
        });
        group.append(b);
      });
      parts.push(el('p', { class: 'chart-count' }, `${sizes.length} size${sizes.length > 1 ? 's' : ''} found; pick one to fill in the frame numbers.`), group);
    } else {
      parts.push(el('p', { class: 'chart-none' }, 'No sizes could be read from this text.'));
    }
    parts.push(list('Rows not recognised', run.unrecognised, 'chart-unrecognised'));
    parts.push(list('Questions', run.questions, 'chart-questions'));
    parts.push(list('Notes', run.notes, 'chart-notes'));
    if (run.error) parts.push(el('p', { class: 'msg' }, run.error.message ?? String(run.error)));
    out.replaceChildren(...parts.filter(Boolean));
  });
}
