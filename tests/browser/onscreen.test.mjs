// Browser tests of web/ui/onscreen.js: an edit writes the parts on the screen at once and the
// parts off it in the next task, and nothing stays stale.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { startAll, openPage, settled } from './harness.mjs';
import { cell } from './page-helpers.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 60000 };

/** Sets reach in one task and reports what the page shows right after the handler. */
function editReach(value) {
  const input = document.querySelector('[name="frame.reach_mm"]');
  input.value = value;
  input.dispatchEvent(new Event('input', { bubbles: true }));
  const td = document.querySelector('#results tr[data-key="reach_mm"] td[data-col="given"]');
  return { stale: document.documentElement.dataset.stale === 'true', given: td.textContent };
}

test('phone at the inputs: the off-screen tables follow in the next task', T, async () => {
  const { page, problems } = await openPage(env, { width: 360, height: 740 });
  await page.locator('[name="frame.reach_mm"]').scrollIntoViewIfNeeded();
  // Let the observer learn that the results are off the screen.
  await page.waitForFunction(() => new Promise((ok) => requestAnimationFrame(() => requestAnimationFrame(() => ok(true)))));
  const right = await page.evaluate(editReach, '481');
  assert.equal(right.stale, true, 'the results are queued, not written in the handler');
  assert.doesNotMatch(right.given, /481/);
  await settled(page);
  assert.equal(await cell(page, 'reach_mm', 'given'), 481);
  assert.equal(await page.evaluate(() => document.documentElement.dataset.stale), undefined);
  // A run of quick edits writes only the last values.
  await page.evaluate(() => {
    const input = document.querySelector('[name="frame.reach_mm"]');
    for (const v of ['482', '483', '484']) {
      input.value = v;
      input.dispatchEvent(new Event('input', { bubbles: true }));
    }
  });
  assert.equal(await cell(page, 'reach_mm', 'given'), 484);
  assert.deepEqual(problems, []);
});

test('phone at the top: the drawing and the first table are written in the handler', T, async () => {
  const { page, problems } = await openPage(env, { width: 360, height: 740 });
  await page.waitForFunction(() => new Promise((ok) => requestAnimationFrame(() => requestAnimationFrame(() => ok(true)))));
  const before = await page.evaluate(() => document.querySelector('#drawing svg').outerHTML);
  const right = await page.evaluate(editReach, '455');
  const after = await page.evaluate(() => document.querySelector('#drawing svg').outerHTML);
  assert.notEqual(after, before, 'the drawing on the screen changed in the same task');
  assert.match(right.given, /455/, 'the frame table near the screen changed in the same task');
  await settled(page);
  assert.deepEqual(problems, []);
});
