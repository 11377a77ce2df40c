// The strip of key numbers on a phone: while a person types in the form, the drawing and the
// tables are far above, so a bar at the top of the screen shows the ridden bike's key numbers and
// the count of warnings, written by every edit (style.css shows it only on a narrow screen with
// the focus in the form: <html class="form-focus">). Names come from the glossary's short names,
// the catalogue and the glossary (Rust).

/** The ridden numbers shown, in order. */
const KEYS = ['reach_mm', 'stack_mm', 'head_angle_deg', 'trail_mm', 'wheelbase_mm', 'bb_to_grip_mm'];

/** Whole millimetres and tenths of a degree: the strip is narrow (the tables show more). */
const text = (key, v) => (key.endsWith('_deg') ? `${v.toFixed(1)}°` : `${Math.round(v)} mm`);

/**
 * strip: the strip's element; words: key → catalogue entry or term; short: key → a shorter name
 * for the narrow cells (the full name is the cell's title); form: the inputs. Returns show(bike):
 * writes the numbers of one evaluated bike.
 */
export function createStrip(strip, words, short, form) {
  // Whether the form has the focus, as a class on <html> (style.css shows the strip with it).
  const root = document.documentElement;
  form.addEventListener('focusin', () => root.classList.add('form-focus'));
  form.addEventListener('focusout', (e) => {
    if (!form.contains(e.relatedTarget)) root.classList.remove('form-focus');
  });
  // Only while the focused field is on the screen: scrolled up to the drawing with the keyboard
  // still open, the strip would cover the page (style.css: <html class="field-seen">).
  const seen = new IntersectionObserver(([e]) => root.classList.toggle('field-seen', e.isIntersecting));
  form.addEventListener('focusin', (e) => {
    seen.disconnect();
    seen.observe(e.target);
  });

  const cells = new Map();
  const list = document.createElement('dl');
  for (const key of KEYS) {
    const item = document.createElement('div');
    const name = document.createElement('dt');
    const value = document.createElement('dd');
    name.textContent = short.get(key) ?? words.get(key)?.label ?? key;
    item.title = words.get(key)?.label ?? key;
    item.dataset.key = key;
    value.textContent = '–';
    item.append(name, value);
    list.append(item);
    cells.set(key, value);
  }
  const cautions = document.createElement('a');
  cautions.href = '#results-title';
  cautions.className = 'strip-cautions';
  // A tap on a number says what it is, in the strip. The press keeps the focus in the form (the
  // strip shows only while the form has it, and a phone's keyboard would close).
  const def = document.createElement('p');
  def.className = 'strip-def';
  def.setAttribute('role', 'status');
  def.hidden = true;
  for (const type of ['pointerdown', 'mousedown']) list.addEventListener(type, (e) => e.preventDefault());
  list.addEventListener('click', (e) => {
    const key = e.target.closest('[data-key]')?.dataset.key;
    const t = key && words.get(key);
    if (!t || (!def.hidden && def.dataset.key === key)) {
      def.hidden = true;
      return;
    }
    const name = document.createElement('strong');
    name.textContent = t.label;
    def.replaceChildren(name, ` ${t.definition}`);
    def.dataset.key = key;
    def.hidden = false;
  });
  // Typing goes on: the sentence goes (the strip is short again, clear of the field).
  form.addEventListener('input', () => { if (!def.hidden) def.hidden = true; });
  strip.append(list, cautions, def);

  return function show(bike) {
    for (const [key, cell] of cells) {
      const v = bike.ridden?.[key];
      const shown = Number.isFinite(v) ? text(key, v) : '–';
      if (cell.textContent !== shown) cell.textContent = shown;
    }
    // Cautions, disagreeing numbers and fit checks outside their range: all a person should read.
    const listed = (bike.warnings ?? []).filter((w) => w.code.startsWith('caution') || w.code === 'inconsistent').length;
    const n = listed + (bike.checks ?? []).filter((c) => c.within === false).length;
    const said = n ? `${n} warning${n > 1 ? 's' : ''}` : 'No warnings';
    if (cautions.textContent !== said) cautions.textContent = said;
    cautions.classList.toggle('some', n > 0);
    const to = listed ? '#warnings' : n ? '#checks' : '#results-title';
    if (cautions.getAttribute('href') !== to) cautions.setAttribute('href', to);
  };
}
