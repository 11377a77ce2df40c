// Browser tests of the on-demand wasm module (pkg/framewise_extras: the chart importer and the
// QR code): the first view never requests it, the first paste or QR code loads it once, and a
// failed load gives a plain message and can be tried again.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { startAll } from './harness.mjs';

const T = { timeout: 60000 };
const CHART = 'Size\tS\tM\nReach\t450\t475\nStack\t620\t630\nHTA\t65\t65\n';
let env;
before(async () => { env = await startAll(); });
after(async () => { await env.stop(); });

/** A page with the service worker blocked (its background precache would fetch every file). */
async function open() {
  const context = await env.browser.newContext({ serviceWorkers: 'block' });
  const page = await context.newPage();
  const requests = [];
  page.on('request', (r) => requests.push(new URL(r.url()).pathname));
  const problems = [];
  page.on('pageerror', (e) => problems.push(e.message));
  await page.goto(env.base);
  await page.waitForSelector('html[data-ready="true"]', { timeout: 15000 });
  return { page, context, requests, problems };
}

const extras = (requests) => requests.filter((p) => p.includes('framewise_extras'));

test('the first view never requests the on-demand module; a paste loads it once', T, async () => {
  const { page, context, requests, problems } = await open();
  await page.fill('input[name="frame.reach_mm"]', '480');
  await page.waitForTimeout(300);
  assert.deepEqual(extras(requests), [], 'first view and an edit load only the main module');
  assert.ok(requests.includes('/pkg/framewise_bg.wasm'));
  await page.locator('#chart-text').focus();
  await page.evaluate((text) => {
    const box = document.querySelector('#chart-text');
    box.value = text;
    box.dispatchEvent(new ClipboardEvent('paste', { bubbles: true }));
  }, CHART);
  await page.waitForFunction(() => performance.getEntriesByType('resource')
    .some((e) => e.name.endsWith('framewise_extras_bg.wasm')), null, { timeout: 10000 });
  await page.click('#chart-read');
  await page.waitForSelector('#chart-out button.size[data-size="M"]', { timeout: 10000 });
  await page.click('#share-qr-toggle');
  await page.waitForSelector('#share-qr svg[role="img"] path', { timeout: 10000 });
  assert.deepEqual(extras(requests).sort(), ['/pkg/framewise_extras.js', '/pkg/framewise_extras_bg.wasm'],
    'one load serves the chart and the QR code');
  assert.deepEqual(problems, []);
  await context.close();
});

test('a failed load says so in plain words and the next press tries again', T, async () => {
  const { page, context } = await open();
  await page.route('**/framewise_extras*', (route) => route.abort());
  await page.fill('#chart-text', CHART);
  await page.click('#chart-read');
  const error = page.locator('#chart-out .chart-error');
  await error.waitFor({ timeout: 10000 });
  assert.match(await error.textContent(), /could not be loaded/);
  assert.equal(await page.locator('#chart-read').isDisabled(), false);
  await page.click('#share-qr-toggle');
  await page.waitForFunction(() => document.querySelector('#share-msg').dataset.kind === 'bad', null, { timeout: 10000 });
  assert.match(await page.locator('#share-msg').textContent(), /QR code could not be loaded/);
  assert.equal(await page.locator('#share-qr-toggle').getAttribute('aria-expanded'), 'false');
  // The network is back: the same button works.
  await page.unroute('**/framewise_extras*');
  await page.click('#chart-read');
  await page.waitForSelector('#chart-out button.size[data-size="S"]', { timeout: 10000 });
  await context.close();
});
