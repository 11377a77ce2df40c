// A tap or hover on a number in the drawing (a dimension label, the braking and slope limits)
// says what it is, under the drawing, in the words of the tables (the catalogue and the glossary,
// Rust). The zoom captures the pointer on the drawing's box, so a tap is told from a drag by
// where it went down and came up, not by a click on the label.

/** The glossary term of each of the centre of mass's labels (crates/draw figure.rs keys). */
const LIMIT_TERMS = { braking: 'pitch_over_decel_g', climb: 'rear_tip_slope_deg', descent: 'front_tip_slope_deg' };

/** A press that moves less than this is a tap, CSS px. */
const TAP_PX = 8;

/** The term key and the posture (or '') of a label's `data-k` ("dim-reach_mm", "seated-climb"). */
function termOf(k) {
  if (k.startsWith('dim-')) return [k.slice(4), ''];
  const [posture, what] = k.split('-');
  return LIMIT_TERMS[what] ? [LIMIT_TERMS[what], posture] : [null, ''];
}

/** container: the drawing's box; out: where the sentence goes; words: key → {label, definition}. */
export function explainLabels(container, out, words) {
  let shownFor = null;
  // again: a tap on the label shown takes it away; a mouse's click on it keeps it (the hover
  // before the click showed it).
  function show(text, again = 'hide') {
    const k = text?.dataset.k ?? null;
    const [key, posture] = k ? termOf(k) : [null, ''];
    const t = key && words.get(key);
    if (!t || (k === shownFor && again === 'hide')) {
      shownFor = null;
      out.hidden = true;
      return;
    }
    shownFor = k;
    const name = document.createElement('strong');
    name.textContent = posture ? `${t.label}, ${posture}` : t.label;
    out.replaceChildren(name, ` ${t.definition}`);
    out.hidden = false;
  }
  let down = null;
  container.addEventListener('pointerdown', (e) => {
    down = { label: e.target.closest?.('text.label') ?? null, x: e.clientX, y: e.clientY, id: e.pointerId, mouse: e.pointerType === 'mouse' };
  });
  container.addEventListener('pointerup', (e) => {
    const tap = down && down.id === e.pointerId && Math.hypot(e.clientX - down.x, e.clientY - down.y) < TAP_PX;
    if (tap && down.label) show(down.label, down.mouse ? 'keep' : 'hide');
    down = null;
  });
  container.addEventListener('pointerover', (e) => {
    if (e.pointerType !== 'mouse') return;
    const label = e.target.closest?.('text.label');
    if (label && label.dataset.k !== shownFor) show(label);
  });
}
