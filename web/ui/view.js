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
  for (const p of posture) p.addEventListener('change', sync);
  dims.addEventListener('change', sync);
  ghost.addEventListener('change', sync);
  sync();
}
