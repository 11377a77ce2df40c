// Browser tests of the page's other flows at phone and desk sizes: seated and standing, sag and a
// fork change (checked against the §8a re-posing formulas), dimensions, zoom and pan, the
// explanations of numbers, keyboard use, axe-core in light and dark, and screenshots.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import AxeBuilder from '@axe-core/playwright';
import { startAll, openPage, SHOTS, shot, frames } from './harness.mjs';
import { waitCell, zoomIn } from './page-helpers.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 60000 };
const SIZES = [['phone', 360, 740], ['desk', 1280, 800]];
const rad = (d) => (d * Math.PI) / 180;
const deg = (r) => (r * 180) / Math.PI;

const shown = (page, sel) => page.$$eval(sel, (els) => els.map((e) => getComputedStyle(e).display !== 'none'));

/**
 * The demo frame's ridden head angle and wheelbase after the front axle moves `delta` mm along
 * the steering axis (positive = away from the crown: a longer fork; negative: sag).
 * Source: DESIGN.md §8a — T = (reach, stack), d = (cos h, −sin h), n = (sin h, cos h),
 * C = T + d·(head tube + lower stack), F = C + d·a2c + n·offset; equal wheels put the axles level
 * (R.y = F.y, rear centre = √(chainstay² − R.y²)); re-posing rotates the frame about the BB until
 * the axles are level again, so the head angle grows by the angle of the line R → F′.
 */
function reposed(delta) {
  const h = rad(65);
  const d = [Math.cos(h), -Math.sin(h)];
  const n = [Math.sin(h), Math.cos(h)];
  const c = [470 + d[0] * 122, 635 + d[1] * 122];
  const f = [c[0] + d[0] * 561 + n[0] * 44, c[1] + d[1] * 561 + n[1] * 44];
  const r = [-Math.sqrt(435 ** 2 - f[1] ** 2), f[1]];
  const f2 = [f[0] + d[0] * delta, f[1] + d[1] * delta];
  const alpha = Math.atan2(f2[1] - r[1], f2[0] - r[0]);
  return { head: 65 + deg(alpha), wheelbase: Math.hypot(f2[0] - r[0], f2[1] - r[1]) };
}

for (const [name, width, height] of SIZES) {
  test(`${name}: seated and standing switch the rider and centre of mass shown`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    assert.equal(await page.locator('#drawing svg .posture.seated').count(), 1);
    assert.equal(await page.locator('#drawing svg .posture.standing').count(), 1);
    assert.deepEqual(await shown(page, '#drawing svg .posture'), [true, false]);
    await page.locator('label[for="posture-standing"]').click();
    assert.deepEqual(await shown(page, '#drawing svg .posture'), [false, true]);
    // The choice survives a redraw.
    await page.fill('input[name="frame.reach_mm"]', '480');
    assert.deepEqual(await shown(page, '#drawing svg .posture'), [false, true]);
    await page.locator('label[for="posture-seated"]').click();
    assert.deepEqual(await shown(page, '#drawing svg .posture'), [true, false]);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: sag and a longer fork re-pose the bike as the formulas say`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    const stockGhost = await page.locator('#drawing svg .ghost').innerHTML();
    const ghostPoints = () => page.$$eval('#drawing svg .ghost polyline', (ps) => ps.map((p) => p.getAttribute('points').split(/[ ,]/).map(Number)));
    const stockPoints = await ghostPoints();
    await page.fill('input[name="changes.fork_travel_mm"]', '150');
    await page.fill('input[name="changes.front_sag_pct"]', '20');
    let want = reposed(-30);
    await waitCell(page, 'head_angle_deg', want.head, 0.06);
    await waitCell(page, 'wheelbase_mm', want.wheelbase, 0.06);
    await page.fill('input[name="changes.fork_a2c_delta_mm"]', '20');
    want = reposed(-10);
    await waitCell(page, 'head_angle_deg', want.head, 0.06);
    await waitCell(page, 'wheelbase_mm', want.wheelbase, 0.06);
    // The stock column and the ghost stay the stock frame: the ghost's shape as it was, only
    // moved up or down so that its tyres stand on the ridden bike's ground (crates/draw ghost.rs).
    await waitCell(page, 'head_angle_deg', 65, 0.06, 'stock');
    const moved = await ghostPoints();
    const dy = moved[0][1] - stockPoints[0][1];
    assert.equal(moved.length, stockPoints.length);
    moved.forEach((pts, i) => pts.forEach((v, k) => {
      const want = stockPoints[i][k] + (k % 2 ? dy : 0);
      assert.ok(Math.abs(v - want) <= 0.11, `ghost polyline ${i} value ${k}: ${v}, want ${want}`);
    }));
    const ground = Number((await page.locator('#drawing svg [data-k="ground"]').getAttribute('points')).split(/[ ,]/)[1]);
    const tyre = Number((await page.locator('#drawing svg [data-k="ghost-tyre-rear"]').getAttribute('points')).split(/[ ,]/)[1]);
    const radius = Number(await page.locator('#drawing svg [data-k="ghost-tyre-rear.r"]').getAttribute('r'));
    assert.ok(Math.abs(tyre + radius - ground) <= 0.11, `the ghost's tyre (${tyre} + ${radius}) on the ground (${ground})`);
    assert.notEqual(await page.locator('#drawing svg .ridden').innerHTML(), stockGhost);
    // A longer fork brings its caution.
    assert.match(await page.locator('#results .warnings').textContent(), /20 mm longer than stock/);
    // As a person does: a tap on the toggle (its checkbox is hidden inside the label).
    await page.locator('label.toggle:has(#show-dims)').click();
    assert.equal(await page.locator('#show-dims').isChecked(), true);
    await shot(page, `${SHOTS}/page-${name}-sag-fork.png`);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: dimensions, ghost and zoom`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    assert.deepEqual(await shown(page, '#drawing svg .dims'), [false]);
    await page.locator('label.toggle:has(#show-dims)').click();
    assert.deepEqual(await shown(page, '#drawing svg .dims'), [true]);
    for (const key of ['reach_mm', 'stack_mm', 'wheelbase_mm', 'bb_height_mm', 'trail_mm']) {
      assert.equal(await page.locator(`#drawing svg .dim-${key} text`).count(), 1, key);
    }
    await page.locator('label.toggle:has(#show-ghost)').click();
    assert.deepEqual(await shown(page, '#drawing svg .ghost'), [false]);
    const svg = page.locator('#drawing svg');
    const { fit, zoomed, box } = await zoomIn(page);
    assert.notEqual(zoomed, fit);
    assert.ok(Number(zoomed.split(' ')[2]) < Number(fit.split(' ')[2]), 'zoomed in');
    // Drag pans; the view is kept when an edit redraws.
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2 + 40, box.y + box.height / 2, { steps: 4 });
    await page.mouse.up();
    const panned = await svg.getAttribute('viewBox');
    assert.notEqual(panned, zoomed);
    await page.fill('input[name="frame.stack_mm"]', '640');
    await page.waitForFunction((v) => document.querySelector('#drawing svg').getAttribute('viewBox') === v, panned, { timeout: 5000 });
    await page.locator('#fit-view').click();
    assert.notEqual(await page.locator('#drawing svg').getAttribute('viewBox'), panned);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: a tap on a name explains the number; the keyboard reaches everything`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    const term = page.locator('#results tr[data-key="trail_mm"] button.term').first();
    assert.match(await term.getAttribute('title'), /steering axis/);
    await term.click();
    assert.match(await page.locator('#results tr.def-row[data-def-for="trail_mm"]').textContent(),
      /On the ground, horizontal distance from where the steering axis meets it/);
    // The open explanation survives a redraw, and closes on a second tap.
    await page.fill('input[name="frame.reach_mm"]', '471');
    assert.equal(await page.locator('#results tr.def-row[data-def-for="trail_mm"]').count(), 1);
    await page.locator('#results tr[data-key="trail_mm"] button.term').first().click();
    assert.equal(await page.locator('#results tr.def-row[data-def-for="trail_mm"]').count(), 0);
    // A tap on the number itself explains it too, and hovering it shows the same sentence.
    const number = page.locator('#results tr[data-key="trail_mm"] td[data-col="solved"], #results tr[data-key="trail_mm"] td').first();
    assert.match(await number.evaluate((td) => td.closest('tr').title), /steering axis/);
    await number.click();
    assert.equal(await page.locator('#results tr.def-row[data-def-for="trail_mm"]').count(), 1);
    await number.click();
    assert.equal(await page.locator('#results tr.def-row[data-def-for="trail_mm"]').count(), 0);
    // Keyboard: focus a term and press Enter; focus an input and see its definition.
    await page.locator('#results tr[data-key="stack_mm"] button.term').first().focus();
    await page.keyboard.press('Enter');
    assert.equal(await page.locator('#results tr.def-row[data-def-for="stack_mm"]').count(), 1);
    await page.locator('input[name="frame.reach_mm"]').focus();
    assert.ok(await page.locator('#f-frame-reach-mm-def').isVisible());
    await page.keyboard.press('Tab');
    assert.equal(await page.evaluate(() => document.activeElement.name), 'frame.stack_mm');
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.type('x');
    // A problem with the field being typed in is said after a pause in typing (web/app.js).
    await page.waitForSelector('input[name="frame.reach_mm"][aria-invalid="true"]', { timeout: 5000 });
    assert.deepEqual(problems, []);
    await context.close();
  });

  for (const scheme of ['light', 'dark']) {
    test(`${name} ${scheme}: axe-core finds no violations; screenshots`, T, async () => {
      const { page, context, problems } = await openPage(env, { width, height });
      await page.emulateMedia({ colorScheme: scheme });
      await page.locator('label.toggle:has(#show-dims)').click();
      await page.locator('#results tr[data-key="trail_mm"] button.term').first().click();
      for (const d of await page.locator('details.more').all()) await d.evaluate((e) => { e.open = true; });
      const result = await new AxeBuilder({ page }).analyze();
      const summary = result.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(', ')}`);
      assert.deepEqual(summary, []);
      const small = await page.$$eval('button, summary, select, input:not([type=radio]):not([type=checkbox]), label.toggle, .segmented label',
        (els) => els.filter((e) => e.getBoundingClientRect().height > 0 && e.getBoundingClientRect().height < 44)
          .map((e) => `${e.tagName} ${e.id || e.name || e.textContent.trim().slice(0, 20)}`));
      assert.deepEqual(small, [], 'touch targets at least 44 px high');
      await page.evaluate(() => window.scrollTo(0, 0));
      await shot(page, `${SHOTS}/page-${name}-${scheme}.png`);
      await page.locator('#results').scrollIntoViewIfNeeded();
      await shot(page, `${SHOTS}/page-${name}-${scheme}-numbers.png`);
      // The last input groups (rider, changes): below the numbers' first screen on a desk too.
      await page.locator('#bike-form fieldset.group').last().scrollIntoViewIfNeeded();
      await shot(page, `${SHOTS}/page-${name}-${scheme}-inputs.png`);
      assert.deepEqual(problems, []);
      await context.close();
    });
  }
}

test('desk: a toolbar toggle pressed while a field near the end of the page has the focus takes the click', T, async () => {
  // The focused field's definition shows under it; when the press takes the focus away it goes,
  // the form gets shorter, and at the end of the page the sticky drawing column moves. It goes
  // a moment later (style.css), so a person's press and release land on the same toggle.
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  await page.fill('input[name="changes.fork_a2c_delta_mm"]', '20'); // among the last fields
  // The page scrolled to just before the end of the form pushes the drawing column up: there a
  // shorter form moves the toggle.
  // (Parts drawn only near the screen take their real height when scrolled to: measured twice.)
  const toggleTop = () => page.evaluate(() => document.querySelector('label.toggle:has(#show-dims)').getBoundingClientRect().top);
  const scrollTo = async (y) => { await page.evaluate((to) => window.scrollTo(0, to), y); await frames(page); };
  const max = () => page.evaluate(() => document.documentElement.scrollHeight - innerHeight);
  for (let i = 0; i < 2; i += 1) await scrollTo(await max());
  const pushed = await toggleTop();
  const end = await max();
  await scrollTo(end / 2);
  const stuck = await toggleTop();
  await scrollTo(end - (stuck - pushed) - 4);
  assert.equal(await toggleTop(), stuck, 'the drawing column is still stuck at the top');
  const box = await page.locator('label.toggle:has(#show-dims)').boundingBox();
  assert.ok(box.y >= 0, `the toggle is on the screen: ${JSON.stringify(box)}`);
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.down();
  await page.waitForTimeout(120); // a person's press
  await page.mouse.up();
  assert.equal(await page.locator('#show-dims').isChecked(), true);
  assert.deepEqual(problems, []);
  await context.close();
});
