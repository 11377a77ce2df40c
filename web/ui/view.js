// The drawing's view toggles: rider posture, dimension labels, the stock ghost. They switch
// classes on the drawing container; the SVG already holds every layer (crates/draw).

export function attachView(container) {
  const posture = document.querySelectorAll('input[name="posture"]');
  const dims = document.getElementById('show-dims');
  const ghost = document.getElementById('show-ghost');
  function sync() {
    const standing = document.getElementById('posture-standing').checked;
    container.classList.toggle('posture-standing', standing);
    container.classList.toggle('posture-seated', !standing);
    container.classList.toggle('show-dims', dims.checked);
    container.classList.toggle('hide-ghost', !ghost.checked);
    dims.parentElement.classList.toggle('on', dims.checked);
    ghost.parentElement.classList.toggle('on', ghost.checked);
  }
  const changed = () => { sync(); document.dispatchEvent(new CustomEvent('framewise:view')); };
  for (const p of posture) p.addEventListener('change', changed);
  dims.addEventListener('change', changed);
  ghost.addEventListener('change', changed);
  sync();
  resync = sync;
}

let resync = () => {};
let opened = {}; // the opened link's view: choices this page has no control for are kept

/** The view choices for a share link (scenario `view`). */
export function getView() {
  return {
    ...opened,
    posture: document.getElementById('posture-standing').checked ? 'standing' : 'seated',
    dimensions: document.getElementById('show-dims').checked,
    ghost: document.getElementById('show-ghost').checked,
  };
}

/** Applies the view choices of an opened link. */
export function applyView(view) {
  opened = { ...view };
  if (view.posture) document.getElementById(`posture-${view.posture === 'standing' ? 'standing' : 'seated'}`).checked = true;
  if (typeof view.dimensions === 'boolean') document.getElementById('show-dims').checked = view.dimensions;
  if (typeof view.ghost === 'boolean') document.getElementById('show-ghost').checked = view.ghost;
  resync();
}
