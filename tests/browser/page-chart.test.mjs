// Browser tests of the chart paste box at phone and desk sizes: paste an invented chart, pick a
// size, see its numbers in the form and the tables; rows not recognised are listed; a question
// about an ambiguous row can be answered and changes the reading.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { startAll, openPage, SHOTS, ROOT, shot } from './harness.mjs';
import { cell, waitCell } from './page-helpers.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 60000 };
const SIZES = [['phone', 360, 740], ['desk', 1280, 800]];
const chart = (name) => readFileSync(`${ROOT}tests/charts/${name}`, 'utf8');
const rad = (d) => (d * Math.PI) / 180;
// The first read loads the importer's wasm module (on demand): wait for its answer. Later reads
// are answered in the same task as the click.
const firstRead = (page) => page.waitForFunction(() => {
  const out = document.querySelector('#chart-out');
  return out.children.length > 0 && !out.querySelector('.chart-loading');
}, null, { timeout: 10000 });

for (const [name, width, height] of SIZES) {
  test(`${name}: paste a chart, pick a size, see its numbers`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    await page.fill('#chart-text', chart('01_web_tab_columns.txt'));
    await page.click('#chart-read');
    await firstRead(page);
    assert.deepEqual(await page.locator('#chart-out button.size').allTextContents(), ['S', 'M', 'L', 'XL']);
    await page.click('#chart-out button.size[data-size="L"]');
    assert.equal(await page.locator('#chart-out button.size[data-size="L"]').getAttribute('aria-pressed'), 'true');
    // The form now holds size L's numbers from the chart text; fields the chart lacks are blank.
    assert.equal(await page.inputValue('[name="frame.reach_mm"]'), '475');
    assert.equal(await page.inputValue('[name="frame.wheelbase_mm"]'), '1232');
    assert.equal(await page.inputValue('[name="frame.head_tube_mm"]'), '');
    assert.equal(await page.inputValue('[name="label"]'), 'Chart size L');
    // The box says what the pick did.
    assert.equal(await page.locator('#chart-out .chart-picked').textContent(),
      'Size L: 8 frame numbers filled in. The drawing and the numbers show it.');
    // The table shows them as published (values from the chart text above).
    await waitCell(page, 'reach_mm', 475, 0.05, 'given');
    await waitCell(page, 'stack_mm', 628, 0.05, 'given');
    await waitCell(page, 'head_angle_deg', 64.5, 0.05, 'given');
    // The solved frame is a frame: its trail follows the published formula from its own solved
    // head angle and offset. Source: T = (R·cos h − o)/sin h, R = 622/2 + 2.4·25.4 mm for 29x2.4
    // (Wikipedia, "Bicycle and motorcycle geometry"; ISO 5775 section-height estimate).
    const h = rad(await cell(page, 'head_angle_deg', 'stock'));
    const o = await cell(page, 'fork_offset_mm', 'stock');
    const R = 622 / 2 + 2.4 * 25.4;
    await waitCell(page, 'trail_mm', (R * Math.cos(h) - o) / Math.sin(h), 0.15, 'stock');
    // What the chart did not give is asked for by name.
    assert.match(await page.locator('#results .missing').textContent(), /Fork axle-to-crown/);
    // All of the list is asked for (together they fix the frame), as the warnings say too.
    assert.match(await page.locator('#results .missing p').textContent(), /^Nothing given fixes part of the frame\. Add (these|this) from the listing: /);
    await page.locator('#chart').scrollIntoViewIfNeeded();
    await shot(page, `${SHOTS}/page-${name}-chart.png`);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: a size that cannot be drawn says so beside the sizes, and one that can says it is shown`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    // Size M's reach is mistyped in the chart (4750): refused by the form's range.
    // The chart has no wheel row.
    await page.fill('#chart-text', 'Size\tS\tM\nReach (mm)\t450\t4750\nStack (mm)\t620\t630\nHead tube angle (°)\t65\t65\n');
    await page.click('#chart-read');
    await firstRead(page);
    await page.click('#chart-out button.size[data-size="M"]');
    const said = page.locator('#chart-out .chart-picked');
    // (The reader leaves out a reach of 4750 mm, so the form's reach is blank.)
    assert.equal(await said.textContent(), 'Size M: 2 frame numbers filled in. It could not be drawn: Reach is required: enter a length such as 470 mm, 47 cm or 18.5 in. The marked field in the form says what to check.');
    assert.equal(await said.evaluate((p) => p.classList.contains('chart-error')), true);
    await page.click('#chart-out button.size[data-size="S"]');
    // No wheel row: the form's wheels are kept, and said.
    const wheels = await page.inputValue('[name="wheels.front"]');
    assert.equal(await said.textContent(), `Size S: 3 frame numbers filled in. The chart gives no wheel size, so the wheels in the form (${wheels}) are kept; change them under Wheels and fork if this bike has others.`);
    await waitCell(page, 'reach_mm', 450, 0.05, 'given');
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: a pasted chart is read at once, and a changed text takes the old sizes away`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    // A paste as a browser sends it: the paste event, then the text in the box and an input event.
    await page.locator('#chart-text').evaluate((box, text) => {
      box.focus();
      box.dispatchEvent(new ClipboardEvent('paste', { bubbles: true, cancelable: true }));
      box.value = text;
      box.dispatchEvent(new Event('input', { bubbles: true }));
    }, chart('01_web_tab_columns.txt'));
    await firstRead(page);
    assert.deepEqual(await page.locator('#chart-out button.size').allTextContents(), ['S', 'M', 'L', 'XL']);
    // Typing in the box: the sizes of the text before go, so none of them can be applied.
    await page.fill('#chart-text', chart('02_csv_rows.txt'));
    assert.equal(await page.locator('#chart-out button.size').count(), 0);
    assert.match(await page.locator('#chart-out').textContent(), /The text changed: press "Read the chart"/);
    await page.click('#chart-read');
    assert.ok(await page.locator('#chart-out button.size').count() > 0);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: rows not recognised are listed, rows without a unit are noted once, and questions can be answered`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    await page.fill('#chart-text', chart('09_unknown_rows.txt'));
    await page.click('#chart-read');
    await firstRead(page);
    const unknown = await page.locator('#chart-out .chart-unrecognised li').allTextContents();
    assert.deepEqual(unknown, ['Rider height (cm)']);
    // Parts the page has inputs for are recognised and said where to set them.
    const notes = await page.locator('#chart-out .chart-notes li').allTextContents();
    assert.ok(notes.includes('Stem length: recognised as the stem length, not a frame number: set it under Cockpit'), notes.join(' | '));
    assert.ok(notes.includes('Crank length: recognised as the crank length, not a frame number: set it under Saddle, seatpost and cranks'), notes.join(' | '));
    await page.fill('#chart-text', 'Size\tS\tM\nReach\t450\t475\nStack\t620\t630\nHTA\t65\t65\nSTA\t76\t76\n');
    await page.click('#chart-read');
    await page.click('#chart-out button.size[data-size="M"]');
    // Reach and stack have no unit: one note names both, as a sentence; the angles none.
    assert.deepEqual(await page.locator('#chart-out .chart-notes li').allTextContents(),
      ['No unit given for Reach, Stack: read as mm from the size of the numbers']);
    await page.locator('#chart-out .chart-notes').scrollIntoViewIfNeeded();
    await shot(page, `${SHOTS}/page-${name}-chart-notes.png`, {}, page.locator('#chart-out'));
    const q = page.locator('#chart-out .chart-questions select').first();
    assert.deepEqual(await q.locator('option').allTextContents(), ['effective', 'actual']);
    assert.equal(await page.inputValue('[name="frame.seat_angle_effective_deg"]'), '76');
    await q.selectOption('actual');
    await page.waitForFunction(() => document.querySelector('[name="frame.seat_angle_actual_deg"]').value === '76', null, { timeout: 5000 });
    assert.equal(await page.inputValue('[name="frame.seat_angle_effective_deg"]'), '');
    await waitCell(page, 'seat_angle_actual_deg', 76, 0.05, 'given');
    // A PDF copy with single spaces: a short row asks which sizes its values belong to, and the
    // answer moves them (the chainstay given for M and L only).
    await page.fill('#chart-text', 'Size S M L\nReach 430 455 480\nStack 611 620 629\nChainstay 435 440\n');
    await page.click('#chart-read');
    await page.click('#chart-out button.size[data-size="L"]');
    const sizesQ = page.locator('#chart-out .chart-questions li', { hasText: 'Chainstay' });
    assert.match(await sizesQ.textContent(), /"Chainstay" gives 2 values for 3 sizes/);
    assert.equal(await page.inputValue('[name="frame.chainstay_mm"]'), '');
    await sizesQ.locator('select').selectOption('the last 2 sizes');
    await page.waitForFunction(() => document.querySelector('[name="frame.chainstay_mm"]').value === '440', null, { timeout: 5000 });
    await page.click('#chart-out button.size[data-size="S"]');
    assert.equal(await page.inputValue('[name="frame.chainstay_mm"]'), '');
    // Nonsense gets a plain message and leaves the bike alone.
    const svg = await page.locator('#drawing svg').innerHTML();
    await page.fill('#chart-text', 'hello');
    await page.click('#chart-read');
    assert.ok((await page.locator('#chart-out .chart-error').textContent()).length > 10);
    assert.equal(await page.locator('#drawing svg').innerHTML(), svg);
    assert.deepEqual(problems, []);
    await context.close();
  });
}
