// Browser tests of the first slice: the page loads the wasm kernel, draws the demo bike, shows
// the table, follows edits and explains bad values.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { startAll, openPage, SHOTS } from './harness.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 30000 };

function cellNumber(text) {
  return Number.parseFloat(text.replace(/[^0-9.+-]/g, ''));
}

test('the page loads, draws the demo bike and shows the table', T, async () => {
  const { page, context, problems } = await openPage(env);
  assert.equal(await page.locator('#drawing svg .ridden .tyre').count(), 2);
  assert.equal(await page.locator('#drawing svg .ground').count(), 1);
  assert.equal(await page.locator('#drawing svg .ridden .fork').count(), 1);
  assert.equal(await page.locator('#results tbody tr').count(), 5);
  await page.screenshot({ path: `${SHOTS}/slice-desktop.png`, fullPage: true });
  await page.setViewportSize({ width: 360, height: 740 });
  await page.screenshot({ path: `${SHOTS}/slice-phone.png`, fullPage: true });
  assert.deepEqual(problems, []);
  await context.close();
});

test('the trail in the table equals the published formula', T, async () => {
  const { page, context, problems } = await openPage(env);
  // Source: ground trail T = (R·cos h − o) / sin h, R the outer tyre radius, h the head angle,
  // o the fork offset (Wikipedia, "Bicycle and motorcycle geometry"). Demo: 29x2.4 tyre →
  // R = 622/2 + 2.4·25.4 mm (ISO 5775 section-height estimate), h = 65°, o = 44 mm.
  const R = 622 / 2 + 2.4 * 25.4;
  const h = (65 * Math.PI) / 180;
  const expected = (R * Math.cos(h) - 44) / Math.sin(h);
  const shown = cellNumber(await page.locator('#results tr[data-key="trail_mm"] td').textContent());
  assert.ok(Math.abs(shown - expected) <= 0.05, `trail shown ${shown}, formula ${expected}`);
  // Change the offset and check again against the same formula.
  await page.fill('input[name="frame.fork_offset_mm"]', '51');
  const expected51 = (R * Math.cos(h) - 51) / Math.sin(h);
  await page.waitForFunction(
    (want) => Math.abs(Number.parseFloat(document.querySelector('#results tr[data-key="trail_mm"] td').textContent) - want) <= 0.05,
    expected51, { timeout: 5000 });
  assert.deepEqual(problems, []);
  await context.close();
});

test('editing a field changes the drawing and the table together', T, async () => {
  const { page, context, problems } = await openPage(env);
  const before = await page.locator('#drawing svg').innerHTML();
  const wbBefore = await page.locator('#results tr[data-key="wheelbase_mm"] td').textContent();
  await page.fill('input[name="frame.reach_mm"]', '500');
  await page.waitForFunction((old) => document.querySelector('#drawing svg').innerHTML !== old, before, { timeout: 5000 });
  const wbAfter = await page.locator('#results tr[data-key="wheelbase_mm"] td').textContent();
  assert.ok(Math.abs(cellNumber(wbAfter) - cellNumber(wbBefore) - 30) < 0.2, `${wbBefore} → ${wbAfter}`);
  assert.deepEqual(problems, []);
  await context.close();
});

test('a bad value shows its message beside the field and the last drawing stays', T, async () => {
  const { page, context, problems } = await openPage(env);
  const good = await page.locator('#drawing svg').innerHTML();
  const cases = [
    ['frame.head_angle_deg', 'steep', /"steep" is not a number/],
    ['frame.head_angle_deg', '', /empty/],
    ['frame.head_angle_deg', '95', /Head tube angle must be between 45 and 85 °, got 95/],
    ['wheels.front', '31x9', /not recognised/],
  ];
  for (const [name, value, pattern] of cases) {
    await page.fill(`input[name="${name}"]`, value);
    const input = page.locator(`input[name="${name}"]`);
    const msgId = await input.getAttribute('aria-describedby');
    assert.ok(msgId, `${name}=${value} has no message`);
    assert.match(await page.locator(`#${msgId}`).textContent(), pattern);
    assert.equal(await input.getAttribute('aria-invalid'), 'true');
    assert.equal(await page.locator('#drawing svg').innerHTML(), good, 'the last good drawing stays');
    assert.doesNotMatch(await page.locator('body').textContent(), /NaN|Infinity/);
  }
  await page.screenshot({ path: `${SHOTS}/slice-bad-value.png`, fullPage: true });
  await page.fill('input[name="wheels.front"]', '29x2.4');
  await page.fill('input[name="frame.head_angle_deg"]', '65');
  await page.waitForFunction(() => !document.querySelector('[aria-invalid="true"]'), null, { timeout: 5000 });
  assert.deepEqual(problems, []);
  await context.close();
});
