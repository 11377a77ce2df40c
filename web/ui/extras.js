// The on-demand wasm module, pkg/framewise_extras (crates/extras: the chart importer and the QR
// code of a link). The first view never requests it; ui/chart.js loads it on the first paste or
// "Read the chart", ui/share.js on the first "Show QR code".

let extras = null;

/**
 * The on-demand module, initialised: one load shared by every caller; a failed load is
 * forgotten, so the next call tries again.
 */
export function loadExtras() {
  // From the page's address, not this file's: the built site bundles this file into app.js.
  extras ??= import(new URL('pkg/framewise_extras.js', document.baseURI).href)
    .then(async (m) => { await m.default(); return m; })
    .catch((e) => { extras = null; throw e; });
  return extras;
}
