// Pinch, wheel and drag zoom and pan on the drawing, by changing the SVG viewBox. The drawing
// arrives fitted to the bike; once the person zooms, the chosen view is kept across redraws
// (restore) and patches (refit) until "Fit" is pressed.
// The drawing must not trap scrolling: on a touch screen one finger scrolls the page until the
// drawing is zoomed (then it moves the drawing; the container's `zoomed` class switches
// touch-action in style.css); a mouse wheel scrolls the page, and zooms with Ctrl held (a
// trackpad pinch arrives as a wheel with Ctrl).
// The keyboard: while the drawing's box has the focus (tabindex in index.html), + or = and -
// zoom about the middle of the view, the arrow keys move it a tenth of its size, 0 or Home fits.
// Other keys (and any with Ctrl, Alt or Meta: the browser's own zoom) are left alone.

/** Keys → a zoom factor, a step [x, y] in tenths of the view, or 0: fit. */
const KEYS = { '+': 1.25, '=': 1.25, '-': 0.8, 0: 0, Home: 0, ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };

export function attachZoom(container, fitButton) {
  let view = null; // [x, y, w, h] chosen by the person, or null = the drawing's own fit
  const pointers = new Map();
  let last = null; // previous gesture state: { cx, cy, dist }

  const svg = () => container.querySelector('svg');
  const current = () => view ?? svg()?.getAttribute('viewBox')?.split(/[ ,]+/).map(Number);

  function apply() {
    container.classList.toggle('zoomed', view !== null);
    const s = svg();
    if (!s || !view) return;
    if (!s.dataset.fit) s.dataset.fit = s.getAttribute('viewBox');
    s.setAttribute('viewBox', view.map((v) => v.toFixed(1)).join(' '));
    // Zoomed in, the labels keep their size on the screen (style.css divides theirs by --z).
    s.style.setProperty('--z', Math.max(s.dataset.fit.split(' ')[2] / view[2], 1).toFixed(3));
  }

  function fit() {
    view = null;
    container.classList.remove('zoomed');
    const s = svg();
    if (s?.dataset.fit) s.setAttribute('viewBox', s.dataset.fit);
    s?.style.removeProperty('--z');
  }

  // Screen point → drawing units, for the current viewBox and the element's box.
  function toDrawing(px, py) {
    const s = svg();
    const v = current();
    if (!s || !v) return null;
    const m = s.getScreenCTM();
    if (!m) return null;
    const p = new DOMPoint(px, py).matrixTransform(m.inverse());
    return [p.x, p.y, v];
  }

  // Zooms the view v by `factor` about the drawing point (x, y), within 150 mm to 20 m wide.
  function zoomAbout(x, y, v, factor) {
    const k = Math.min(Math.max(v[2] / factor, 150), 20000) / v[2];
    view = [x - (x - v[0]) * k, y - (y - v[1]) * k, v[2] * k, v[3] * k];
    apply();
  }

  function zoomAt(px, py, factor) {
    const hit = toDrawing(px, py);
    if (hit) zoomAbout(...hit, factor);
  }

  function panBy(dx, dy) {
    const s = svg();
    const v = current();
    if (!s || !v) return;
    // The drawing is fitted into its box ("meet"): the tighter side sets the scale.
    const box = s.getBoundingClientRect();
    const scale = Math.max(v[2] / box.width, v[3] / box.height);
    view = [v[0] - dx * scale, v[1] - dy * scale, v[2], v[3]];
    apply();
  }

  function gesture() {
    const ps = [...pointers.values()];
    const cx = ps.reduce((a, p) => a + p.x, 0) / ps.length;
    const cy = ps.reduce((a, p) => a + p.y, 0) / ps.length;
    const dist = ps.length > 1 ? Math.hypot(ps[0].x - ps[1].x, ps[0].y - ps[1].y) : 0;
    return { cx, cy, dist, n: ps.length };
  }

  container.addEventListener('pointerdown', (e) => {
    if (!svg()) return;
    container.setPointerCapture?.(e.pointerId);
    pointers.set(e.pointerId, { x: e.clientX, y: e.clientY });
    last = gesture();
  });
  container.addEventListener('pointermove', (e) => {
    if (!pointers.has(e.pointerId)) return;
    pointers.set(e.pointerId, { x: e.clientX, y: e.clientY });
    const g = gesture();
    if (last && g.n === last.n) {
      if (g.n > 1 && last.dist > 0 && g.dist > 0) zoomAt(g.cx, g.cy, g.dist / last.dist);
      // A drawing that is not zoomed shows the whole bike: one finger on it is the page's
      // (sideways too), and a mouse drag moves nothing (the hint: drag moves a zoomed drawing).
      if (g.n > 1 || view) panBy(g.cx - last.cx, g.cy - last.cy);
    }
    last = g;
  });
  const up = (e) => { pointers.delete(e.pointerId); last = pointers.size ? gesture() : null; };
  container.addEventListener('pointerup', up);
  container.addEventListener('pointercancel', up);
  container.addEventListener('wheel', (e) => {
    if (!svg() || !e.ctrlKey) return; // a plain wheel scrolls the page
    e.preventDefault();
    zoomAt(e.clientX, e.clientY, Math.exp(-e.deltaY * 0.0015));
  }, { passive: false });
  container.addEventListener('dblclick', fit);
  // A click or a tap does not give the box the focus (only Tab does): the arrows and Home would
  // then move the drawing, not scroll the page, with no ring to say why.
  container.addEventListener('mousedown', (e) => {
    if (document.activeElement !== container) e.preventDefault();
  });
  container.addEventListener('keydown', (e) => {
    const k = KEYS[e.key];
    const v = current();
    if (e.ctrlKey || e.altKey || e.metaKey || !v) return;
    if (k === 0) fit();
    else if (Array.isArray(k)) {
      view = [v[0] + k[0] * v[2] / 10, v[1] + k[1] * v[3] / 10, v[2], v[3]];
      apply();
    }
    else if (k) zoomAbout(v[0] + v[2] / 2, v[1] + v[3] / 2, v, k);
    else return;
    e.preventDefault(); // only a key handled here: the page keeps its scrolling keys
  });
  fitButton.addEventListener('click', fit);

  return {
    /** Re-applies the chosen view to a freshly drawn SVG. */
    restore: apply,
    /** A patched drawing's new fit: shown unless the person has zoomed, kept for "Fit". */
    refit(box) {
      const s = svg();
      if (!s) return;
      s.dataset.fit = box;
      if (!view) s.setAttribute('viewBox', box);
    },
    /** True when the person has zoomed or panned away from the fit. */
    get zoomed() { return view !== null; },
  };
}
