// Browser tests of web/ui/onscreen.js: an edit writes the parts on the screen at once and the
// parts off it in the next task, and nothing stays stale.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { startAll, openPage, settled, frames } from './harness.mjs';
import { cell } from './page-helpers.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 60000 };

/**
 * Scrolls the numbers so the element `selector` finds has its `edge` (top or bottom) `dy` px
 * from the top of the screen, then waits for the observer. On a desk the numbers scroll in their
 * own column (style.css, .view-col); on a phone with the page.
 */
async function scrollNumbers(page, selector, edge, at) {
  await page.evaluate(([selector, edge, at]) => {
    const by = document.querySelector(selector).getBoundingClientRect()[edge] - at;
    const col = document.querySelector('.view-col');
    if (getComputedStyle(col).overflowY === 'auto') col.scrollTop += by;
    else window.scrollBy(0, by);
  }, [selector, edge, at]);
  await frames(page);
}

/** Scrolls so the frame table's reach row is the last on the screen; waits for the observer. */
async function showReachRowLast(page) {
  const height = await page.evaluate(() => innerHeight);
  await scrollNumbers(page, '#results tr[data-key="reach_mm"]', 'bottom', height - 4);
}

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
  await frames(page);
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

test('phone at the top: the drawing is written in the handler, the table below it in the next task', T, async () => {
  const { page, problems } = await openPage(env, { width: 360, height: 740 });
  await frames(page);
  const below = await page.evaluate(() => document.querySelector('#results table').getBoundingClientRect().top > innerHeight);
  assert.equal(below, true, 'the frame table starts below the first screen');
  const before = await page.evaluate(() => document.querySelector('#drawing svg').outerHTML);
  const right = await page.evaluate(editReach, '455');
  const after = await page.evaluate(() => document.querySelector('#drawing svg').outerHTML);
  assert.notEqual(after, before, 'the drawing on the screen changed in the same task');
  assert.equal(right.stale, true, 'the frame table off the screen is queued');
  assert.doesNotMatch(right.given, /455/);
  await settled(page);
  assert.equal(await cell(page, 'reach_mm', 'given'), 455);
  // Once some of the table is on the screen, its rows on the screen are written in the handler
  // and its rows below the screen in the next task.
  await showReachRowLast(page);
  const seen = await page.evaluate(() => {
    const last = document.querySelector('#results tr[data-key="top_tube_effective_mm"]');
    const below = last.getBoundingClientRect().top > innerHeight;
    const before = last.querySelector('td[data-col="stock"]').textContent;
    window.__lastRow = last;
    return { below, before };
  });
  assert.equal(seen.below, true, 'the effective top tube row is below the screen');
  const shown = await page.evaluate(() => {
    const input = document.querySelector('[name="frame.reach_mm"]');
    input.value = '456';
    input.dispatchEvent(new Event('input', { bubbles: true }));
    const given = document.querySelector('#results tr[data-key="reach_mm"] td[data-col="given"]').textContent;
    return { given, last: window.__lastRow.querySelector('td[data-col="stock"]').textContent };
  });
  assert.match(shown.given, /456/, 'the row on the screen changed in the same task');
  assert.equal(shown.last, seen.before, 'the row below the screen is not written in the handler');
  await settled(page);
  // Every row is written once the queue is: the last row shows what a fresh page shows for 456.
  const lastRow = await page.evaluate(() => window.__lastRow.querySelector('td[data-col="stock"]').textContent);
  const fresh = await openPage(env, { width: 360, height: 740 });
  await fresh.page.evaluate(editReach, '456');
  await settled(fresh.page);
  const want = await fresh.page.evaluate(() => document.querySelector('#results tr[data-key="top_tube_effective_mm"]').querySelector('td[data-col="stock"]').textContent);
  assert.equal(lastRow, want);
  assert.notEqual(want, seen.before, 'effective top tube depends on reach');
  assert.deepEqual(problems, []);
  assert.deepEqual(fresh.problems, []);
});

test('rows queued by an edit give way to a later edit; a table wholly on the screen is written at once', T, async () => {
  // Tall enough that the whole frame table fits on the screen once scrolled to it.
  const { page, problems } = await openPage(env, { width: 1280, height: 1400 });
  const topTube = () => document.querySelector('#results tr[data-key="top_tube_effective_mm"] td[data-col="stock"]').textContent;
  await frames(page);
  const start = await page.evaluate(topTube); // the demo's reach, 470
  await showReachRowLast(page);
  // In one task, with the table partly on the screen: an edit (its lower rows queued) and an
  // edit back to the first value (queued again): the later edit's values are the ones written.
  const edit = (values) => page.evaluate(([values, cellKey]) => {
    const input = document.querySelector('[name="frame.reach_mm"]');
    const cell = () => document.querySelector(`#results tr[data-key="${cellKey}"] td[data-col="stock"]`);
    const below = cell().getBoundingClientRect().top > innerHeight;
    const seen = values.map((v) => {
      input.value = v;
      input.dispatchEvent(new Event('input', { bubbles: true }));
      return cell().textContent;
    });
    return { below, seen };
  }, [values, 'top_tube_effective_mm']);
  const partly = await edit(['456', '470']);
  assert.equal(partly.below, true, 'the row is below the screen');
  assert.deepEqual(partly.seen, [start, start], 'the row is not written in the handler');
  await settled(page);
  assert.equal(await page.evaluate(topTube), start, 'no older queued write came after the later edit');
  // The whole table on the screen (as the observer saw it at the last frame): every row is
  // written in the handler.
  await scrollNumbers(page, '#results table', 'top', 10);
  assert.equal(await page.evaluate(() => document.querySelector('#results table').getBoundingClientRect().bottom < innerHeight), true, 'the whole table fits');
  const whole = await edit(['456', '470']);
  assert.equal(whole.below, false);
  assert.notEqual(whole.seen[0], start, 'the first edit wrote the row at once');
  assert.equal(whole.seen[1], start, 'the second edit wrote it back at once');
  await settled(page);
  assert.equal(await page.evaluate(topTube), start);
  // A table written whole drops the rest an older edit queued: with the painter's next task held
  // back, an edit with the table partly on the screen queues its lower rows; once the observer
  // sees the whole table, an edit writes every row at once, and the held task, run last, must
  // not write the older values over them.
  await showReachRowLast(page);
  await page.evaluate(() => {
    window.__held = [];
    window.__setTimeout = window.setTimeout;
    window.setTimeout = (fn) => { window.__held.push(fn); return 0; };
    const input = document.querySelector('[name="frame.reach_mm"]');
    input.value = '456';
    input.dispatchEvent(new Event('input', { bubbles: true }));
    const table = document.querySelector('#results table');
    window.scrollTo(0, table.getBoundingClientRect().top + scrollY - 10);
  });
  await frames(page);
  const last = await page.evaluate((cellKey) => {
    const input = document.querySelector('[name="frame.reach_mm"]');
    input.value = '470';
    input.dispatchEvent(new Event('input', { bubbles: true }));
    const now = document.querySelector(`#results tr[data-key="${cellKey}"] td[data-col="stock"]`).textContent;
    window.setTimeout = window.__setTimeout;
    const held = window.__held.length;
    for (const fn of window.__held) fn();
    return { now, held };
  }, 'top_tube_effective_mm');
  assert.ok(last.held > 0, 'the painter queued a task');
  assert.equal(last.now, start, 'the whole table was written at once');
  await settled(page);
  assert.equal(await page.evaluate(topTube), start, 'the older queued rows did not come after it');
  assert.deepEqual(problems, []);
});

test('a block whose rows change is rebuilt alone; the other blocks keep their nodes', T, async () => {
  const { page, problems } = await openPage(env, { width: 1280, height: 800 });
  const set = (n, v) => page.evaluate(([n, v]) => {
    const i = document.querySelector(`[name="${n}"]`);
    i.value = v;
    i.dispatchEvent(new Event('input', { bubbles: true }));
  }, [n, v]);
  await set('changes.fork_travel_mm', '150');
  await set('changes.front_sag_pct', '20');
  await settled(page);
  const before = await page.evaluate(() => {
    window.__blocks = [...document.getElementById('results').children];
    return document.querySelectorAll('#results .checks li.outside').length;
  });
  // 25 % sag moves a fit and safety check across its range: the checks list changes shape.
  await set('changes.front_sag_pct', '25');
  await settled(page);
  const after = await page.evaluate(() => {
    const now = [...document.getElementById('results').children];
    return {
      kept: now.map((e, i) => e === window.__blocks[i]),
      tables: now.map((e) => e.tagName),
      outside: document.querySelectorAll('#results .checks li.outside').length,
    };
  });
  assert.notEqual(after.outside, before, 'a check crosses its range');
  const checks = after.tables.lastIndexOf('DIV');
  assert.equal(after.kept[checks], false, 'the checks list is rebuilt');
  after.tables.forEach((tag, i) => {
    if (tag === 'TABLE') assert.equal(after.kept[i], true, `table ${i} keeps its node`);
  });
  assert.deepEqual(problems, []);
});
