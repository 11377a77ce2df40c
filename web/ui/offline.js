// Offline use (issue 6): registers the service worker (sw.js) that precaches the page.
export function registerOffline() {
  if (!('serviceWorker' in navigator)) return Promise.resolve(null);
  return navigator.serviceWorker.register('./sw.js').catch((e) => {
    console.warn(`offline use is not available: ${e.message ?? e}`);
    return null;
  });
}
