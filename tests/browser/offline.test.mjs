// Browser tests of offline use (issue 6): the service worker's precache list is exactly the
// page's files (web/'s as written, the built site's as built), a missing file fails the install, and after one visit the page opens and draws
// with the server gone, and a pasted chart is read (the on-demand module comes from the cache).
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync, readdirSync, statSync, cpSync, rmSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { createHash } from 'node:crypto';
import { join, relative } from 'node:path';
import { chromium } from 'playwright-core';
import { startServer } from '../../scripts/serve.mjs';
import { ROOT, CHROMIUM_ARGS, SHOTS, SITE } from './harness.mjs';

const T = { timeout: 60000 };
const WEB = `${ROOT}web`;

function precacheList() {
  const sw = readFileSync(`${WEB}/sw.js`, 'utf8');
  const body = sw.match(/const PRECACHE = \[([^\]]*)\]/)[1];
  return [...body.matchAll(/'([^']*)'/g)].map((m) => m[1]);
}

function filesUnder(dir) {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? filesUnder(path) : [relative(WEB, path)];
  });
}

async function launch() {
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
}

/** Waits until the service worker controls the page (it claims clients on activate). */
async function controlled(page) {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller) {
      await new Promise((ok) => navigator.serviceWorker.addEventListener('controllerchange', ok, { once: true }));
    }
  });
}

function stopServer(server) {
  server.closeAllConnections();
  return new Promise((ok) => server.close(ok));
}

test('the precache list is exactly the files of web/ and the built web/pkg', () => {
  const listed = precacheList();
  assert.equal(new Set(listed).size, listed.length, 'no duplicates');
  assert.ok(listed.includes('./'), 'the shell itself');
  const wanted = filesUnder(WEB).filter((f) => f !== 'sw.js').sort();
  assert.ok(wanted.includes('pkg/framewise_bg.wasm'), 'web/pkg is built (scripts/build)');
  assert.deepEqual(listed.filter((f) => f !== './').sort(), wanted);
  const manifest = JSON.parse(readFileSync(`${WEB}/manifest.webmanifest`, 'utf8'));
  for (const icon of manifest.icons) assert.ok(listed.includes(icon.src), icon.src);
  assert.ok(manifest.icons.some((i) => i.sizes === '512x512' && i.purpose === 'maskable'));
  assert.ok(manifest.icons.some((i) => i.sizes === '192x192'));
});

test('the served site is web/ minified, app.js bundled with its modules, and a cache of exactly its files', () => {
  const filesIn = (root, dir = root) => readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? filesIn(root, path) : [relative(root, path)];
  });
  const web = filesIn(WEB).sort();
  const site = filesIn(SITE).sort();
  // The modules app.js imports are in the bundle, not files of their own; the rest are web/'s,
  // with the chart box's writer, loaded on the first chart read (ui/chart.js).
  const ON_DEMAND = ['ui/chart-read.js'];
  const bundled = web.filter((f) => (/^ui\/.*\.js$/.test(f) && !ON_DEMAND.includes(f)) || f === 'pkg/framewise.js');
  assert.ok(bundled.includes('ui/results.js') && bundled.includes('pkg/framewise.js'));
  assert.ok(ON_DEMAND.every((f) => site.includes(f)), 'the on-demand scripts are files of the site');
  assert.deepEqual(site, web.filter((f) => !bundled.includes(f)), 'scripts/build makes target/site');
  for (const f of site.filter((n) => /\.(js|css)$/.test(n) && n !== 'sw.js' && n !== 'app.js')) {
    const [a, b] = [readFileSync(join(WEB, f), 'utf8'), readFileSync(join(SITE, f), 'utf8')];
    assert.ok(b.length < a.length, `${f} is minified (${b.length} < ${a.length} characters)`);
    assert.ok(!/^\s*\/\//m.test(b), `${f} has no comment lines`);
  }
  // The bundle: smaller than its sources together, no comment lines, no import of a bundled file.
  const app = readFileSync(join(SITE, 'app.js'), 'utf8');
  const sources = ['app.js', ...bundled].reduce((n, f) => n + readFileSync(join(WEB, f), 'utf8').length, 0);
  assert.ok(app.length < sources, `app.js is one minified bundle (${app.length} < ${sources})`);
  assert.ok(!/^\s*\/\//m.test(app));
  assert.doesNotMatch(app, /from\s*["'][^"']*(ui\/|pkg\/framewise\.js)/);
  // The built worker precaches the shell and every file of the site but itself, and its VERSION
  // is sha-256 over each one's path, a NUL and its built bytes, in path order, first 12 hex
  // digits (scripts/site.mjs), recomputed here with node:crypto.
  const sw = readFileSync(`${SITE}/sw.js`, 'utf8');
  const listed = [...sw.match(/const PRECACHE = \[([^\]]*)\]/)[1].matchAll(/'([^']*)'/g)].map((m) => m[1]);
  const files = site.filter((f) => f !== 'sw.js');
  assert.deepEqual(listed, ['./', ...files]);
  const version = sw.match(/const VERSION = '([^']*)'/)[1];
  const hash = createHash('sha256');
  for (const f of files) hash.update(`${f}\0`).update(readFileSync(join(SITE, f)));
  assert.equal(version, hash.digest('hex').slice(0, 12));
});

test('after one visit the page opens and draws with the server stopped', T, async () => {
  const server = await startServer({ root: SITE, port: 0 });
  const base = `http://127.0.0.1:${server.address().port}/`;
  const browser = await launch();
  const problems = [];
  try {
    const context = await browser.newContext();
    const page = await context.newPage();
    page.on('pageerror', (e) => problems.push(e.message));
    const requests = [];
    page.on('request', (r) => requests.push(r.url()));
    const hash = readFileSync(`${ROOT}tests/links/v1-one-bike.txt`, 'utf8').trim();
    await page.goto(base + hash);
    await page.waitForSelector('html[data-ready="true"]', { timeout: 15000 });
    await controlled(page);
    // Every request went to the page's own origin (the worker's precache included).
    for (const u of requests) assert.equal(new URL(u).origin, new URL(base).origin, u);

    await stopServer(server);
    const fromWorker = [];
    page.on('response', (r) => { if (r.fromServiceWorker()) fromWorker.push(new URL(r.url()).pathname); });
    await page.reload();
    await page.waitForSelector('html[data-ready="true"]', { timeout: 15000 });
    assert.equal(await page.locator('#drawing svg .ridden .tyre').count(), 2);
    assert.equal(await page.inputValue('input[name="frame.head_angle_deg"]'), '64.5');
    for (const path of ['/', '/app.js', '/pkg/framewise_bg.wasm']) {
      assert.ok(fromWorker.includes(path), `${path} not from the worker: ${fromWorker}`);
    }
    // The chart importer (the on-demand module, never loaded online here) works offline too:
    // the worker precached it on the first visit.
    await page.fill('#chart-text', 'Size\tS\tM\nReach\t450\t475\nStack\t620\t630\n');
    await page.click('#chart-read');
    await page.waitForSelector('#chart-out button.size[data-size="M"]', { timeout: 10000 });
    for (const path of ['/pkg/framewise_extras.js', '/pkg/framewise_extras_bg.wasm']) {
      assert.ok(fromWorker.includes(path), `${path} not from the worker: ${fromWorker}`);
    }
    // A second tab with no network at all also opens from the cache.
    await context.setOffline(true);
    const second = await context.newPage();
    await second.goto(base);
    await second.waitForSelector('html[data-ready="true"]', { timeout: 15000 });
    assert.equal(await second.locator('#drawing svg .ridden .tyre').count(), 2);
    await second.evaluate(() => { document.documentElement.dataset.renderAll = ''; });
    await second.screenshot({ path: `${SHOTS}/offline.png`, fullPage: true });
    assert.deepEqual(problems, []);
  } finally {
    await browser.close();
    if (server.listening) await stopServer(server);
  }
});

test('a missing file fails the install and old caches are removed on activate', T, async () => {
  const dir = mkdtempSync(join(tmpdir(), 'framewise-sw-'));
  cpSync(SITE, dir, { recursive: true });
  rmSync(join(dir, 'icons/icon-512.png'));
  let server = await startServer({ root: dir, port: 0 });
  const port = server.address().port;
  const base = `http://127.0.0.1:${port}/`;
  const browser = await launch();
  try {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(base);
    await page.waitForSelector('html[data-ready="true"]', { timeout: 15000 });
    const state = await page.evaluate(async () => {
      const reg = await navigator.serviceWorker.register('./sw.js');
      const w = reg.installing ?? reg.waiting ?? reg.active;
      if (!w) return 'none';
      if (w.state === 'redundant' || w.state === 'activated') return w.state;
      return new Promise((ok) => w.addEventListener('statechange', () => {
        if (w.state === 'redundant' || w.state === 'activated') ok(w.state);
      }));
    });
    assert.equal(state, 'redundant', 'the install must fail when a precached file is missing');

    // Put the file back, plant an old cache, install again: only the current cache remains.
    cpSync(`${SITE}/icons/icon-512.png`, join(dir, 'icons/icon-512.png'));
    await stopServer(server);
    server = await startServer({ root: dir, port });
    await page.evaluate(() => caches.open('framewise-v0').then((c) => c.put('old', new Response('old'))));
    await page.reload();
    await page.waitForSelector('html[data-ready="true"]', { timeout: 15000 });
    await controlled(page);
    const version = readFileSync(`${SITE}/sw.js`, 'utf8').match(/const VERSION = '([^']*)'/)[1];
    assert.deepEqual(await page.evaluate(() => caches.keys()), [`framewise-v${version}`]);
  } finally {
    await browser.close();
    await stopServer(server);
    rmSync(dir, { recursive: true, force: true });
  }
});
