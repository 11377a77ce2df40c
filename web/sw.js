// Service worker (issue 6): after one visit the page works with no network.
// Keep PRECACHE equal to the files in web/ (tests/browser/offline.test.mjs compares them). The
// install fails if any file is missing. scripts/build (scripts/site.mjs) writes the built site's
// own list (app.js bundled with the modules it imports, which are then not files of their own)
// and VERSION: a hash of the built files, so any change to them installs a new cache.
const VERSION = 'written-by-scripts-build';
const CACHE = `framewise-v${VERSION}`;
const PRECACHE = [
  './',
  'index.html',
  'app.js',
  'style.css',
  'icon.svg',
  'manifest.webmanifest',
  'icons/icon-192.png',
  'icons/icon-512.png',
  'icons/icon-maskable-512.png',
  'ui/chart.js',
  'ui/chart-read.js',
  'ui/drawing.js',
  'ui/extras.js',
  'ui/form.js',
  'ui/labels.js',
  'ui/offline.js',
  'ui/onscreen.js',
  'ui/results.js',
  'ui/share.css',
  'ui/share.js',
  'ui/strip.js',
  'ui/view.js',
  'ui/zoom.js',
  'pkg/framewise.js',
  'pkg/framewise_bg.wasm',
  // The on-demand module: never requested by the first view, precached for offline use.
  'pkg/framewise_extras.js',
  'pkg/framewise_extras_bg.wasm',
];

self.addEventListener('install', (event) => {
  // cache: 'reload' skips the HTTP cache so a new VERSION stores fresh copies; addAll rejects
  // (and the install fails) if any response is missing or not OK.
  event.waitUntil(
    caches.open(CACHE)
      .then((cache) => cache.addAll(PRECACHE.map((url) => new Request(url, { cache: 'reload' }))))
      .then(() => self.skipWaiting()),
  );
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    caches.keys()
      .then((keys) => Promise.all(keys
        .filter((key) => key.startsWith('framewise-') && key !== CACHE)
        .map((key) => caches.delete(key))))
      .then(() => self.clients.claim()),
  );
});

// Answers from the cache at once (works with no network), then refreshes that cached copy from
// the network in the background, so a rebuilt page shows on the next load even without a VERSION
// bump; with no network the refresh simply fails and the cached copy stays.
function fromCache(event, key) {
  const request = event.request;
  event.respondWith(caches.open(CACHE).then(async (cache) => {
    const hit = await cache.match(key, { ignoreSearch: true });
    if (!hit) return fetch(request);
    event.waitUntil(
      fetch(key, { cache: 'no-cache' })
        .then((fresh) => (fresh.ok ? cache.put(key, fresh) : undefined))
        .catch(() => {}),
    );
    return hit;
  }));
}

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET' || new URL(request.url).origin !== self.location.origin) return;
  // Every navigation gets the cached shell; the scenario is in the fragment, never sent.
  fromCache(event, request.mode === 'navigate' ? 'index.html' : request.url);
});
