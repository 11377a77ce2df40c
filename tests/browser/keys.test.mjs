// The drawing from the keyboard (web/ui/zoom.js): its box takes the focus (Tab reaches it, with
// the page's focus ring), and then + or = and - zoom about the middle of the view by 1.25, the
// arrow keys move it a tenth of its size, 0 and Home show the first view's fit again. The zoom
// keeps the limits of a pinch (150 mm to 20 m wide). Keys typed in the form are the form's.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { startAll, openPage, settled, shot, SHOTS } from './harness.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 60000 };

const viewBox = (page) => page.locator('#drawing svg').getAttribute('viewBox');
const numbers = (box) => box.split(' ').map(Number);

/** Asserts each number of `got` is within 0.1 (the viewBox's rounding) of `want`. */
function near(got, want, what) {
  assert.ok(got.every((v, i) => Math.abs(v - want[i]) <= 0.11), `${what}: ${got.join(' ')}, want ${want.map((v) => v.toFixed(2)).join(' ')}`);
}

test('desk 1280×800: Tab reaches the drawing; + - and the arrows zoom and move it; 0 and Home fit it again', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  const fit = await viewBox(page);
  const [x, y, w, h] = numbers(fit);
  // The control before the drawing in the tab order, then Tab.
  await page.locator('#show-ghost').focus();
  await page.keyboard.press('Tab');
  const focus = await page.evaluate(() => {
    const d = document.activeElement;
    const s = getComputedStyle(d);
    return { id: d.id, visible: d.matches(':focus-visible'), outline: `${s.outlineStyle} ${s.outlineWidth}`, color: s.outlineColor,
      focusColor: getComputedStyle(document.documentElement).getPropertyValue('--focus').trim(), name: d.getAttribute('aria-label') };
  });
  assert.equal(focus.id, 'drawing', 'Tab from the last toolbar toggle focuses the drawing');
  assert.ok(focus.visible, 'the focus ring shows (:focus-visible)');
  assert.equal(focus.outline, 'solid 3px', 'the page\'s focus ring');
  assert.equal(focus.color, 'rgb(217, 142, 0)', `the page's focus colour (${focus.focusColor})`);
  assert.match(focus.name, /zoom.*arrows move/, 'its name says what the keys do');

  // A label's height on the screen: zooming in keeps it (style.css divides by --z, the zoom).
  const labelPx = () => page.locator('#drawing text.label').first().evaluate((t) => t.getBoundingClientRect().height);
  const labelAtFit = await labelPx();

  // + zooms in by 1.25 about the middle: the middle stays where it was.
  const mid = [x + w / 2, y + h / 2];
  const about = (k) => [mid[0] - (w * k) / 2, mid[1] - (h * k) / 2, w * k, h * k];
  await page.keyboard.press('+');
  near(numbers(await viewBox(page)), about(0.8), '+ zooms in 1.25×');
  await page.keyboard.press('=');
  near(numbers(await viewBox(page)), about(0.64), '= zooms in too');
  const zoomedLabel = await labelPx();
  assert.ok(Math.abs(zoomedLabel - labelAtFit) < 0.05 * labelAtFit, `a label ${zoomedLabel} px zoomed 1.5625×, ${labelAtFit} px fitted`);
  await page.keyboard.press('-');
  near(numbers(await viewBox(page)), about(0.8), '- zooms out 1.25×');
  assert.equal(await page.locator('#drawing.zoomed').count(), 1, 'the box knows it is zoomed');

  // The arrows move the view a tenth of its size, as a scroll does: right shows more to the right.
  const z = numbers(await viewBox(page));
  await page.keyboard.press('ArrowRight');
  near(numbers(await viewBox(page)), [z[0] + z[2] / 10, z[1], z[2], z[3]], 'ArrowRight');
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('ArrowDown');
  near(numbers(await viewBox(page)), [z[0] + z[2] / 10, z[1] + z[3] / 5, z[2], z[3]], 'ArrowDown twice');
  await page.keyboard.press('ArrowLeft');
  await page.keyboard.press('ArrowUp');
  near(numbers(await viewBox(page)), [z[0], z[1] + z[3] / 10, z[2], z[3]], 'ArrowLeft, ArrowUp');
  await shot(page, `${SHOTS}/keys-desk-zoomed.png`, { clip: { x: 0, y: 0, width: 1280, height: 800 } });

  // 0 fits again: exactly the first view's box.
  await page.keyboard.press('0');
  assert.equal(await viewBox(page), fit, '0 shows the first view again');
  assert.equal(await labelPx(), labelAtFit, 'fitted, the labels are as first drawn');
  assert.equal(await page.locator('#drawing.zoomed').count(), 0);
  await page.keyboard.press('-');
  assert.notEqual(await viewBox(page), fit);
  await page.keyboard.press('Home');
  assert.equal(await viewBox(page), fit, 'Home shows the first view again');

  // The limits of a pinch: 150 mm wide at the closest, 20 m at the farthest.
  for (let i = 0; i < 30; i += 1) await page.keyboard.press('+');
  assert.equal(numbers(await viewBox(page))[2], 150, 'zoomed in no closer than 150 mm');
  near(numbers(await viewBox(page)).slice(0, 2), [mid[0] - 75, mid[1] - (75 * h) / w], 'still about the middle');
  for (let i = 0; i < 40; i += 1) await page.keyboard.press('-');
  assert.equal(numbers(await viewBox(page))[2], 20000, 'zoomed out no farther than 20 m');
  await page.keyboard.press('0');
  assert.equal(await viewBox(page), fit);

  // With Ctrl the key is the browser's (its own zoom), not the drawing's.
  await page.keyboard.press('Control+Minus');
  await page.keyboard.press('Control+Equal');
  assert.equal(await viewBox(page), fit, 'Ctrl and - or = leave the drawing alone');
  assert.equal(await page.evaluate(() => document.activeElement.id), 'drawing');
  assert.deepEqual(problems, []);
  await context.close();
});

test('phone 360×740: the keys the drawing handles do not scroll the page; the others still do', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 360, height: 740 });
  const fit = await viewBox(page);
  await page.locator('#drawing').focus();
  const top = await page.evaluate(() => scrollY);
  for (const key of ['ArrowDown', 'ArrowDown', 'Home', 'ArrowUp', '-']) await page.keyboard.press(key);
  assert.equal(await page.evaluate(() => scrollY), top, 'arrows, Home and - move the drawing, not the page');
  assert.notEqual(await viewBox(page), fit);
  await page.keyboard.press('PageDown');
  await page.waitForFunction((at) => scrollY > at, top, { timeout: 3000 });
  await page.keyboard.press('0');
  assert.equal(await viewBox(page), fit);
  assert.deepEqual(problems, []);
  await context.close();
});

test('desk: keys typed in the form are the form\'s: - + 0 and the arrows do not touch the drawing', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  const fit = await viewBox(page);
  const reach = page.locator('input[name="frame.reach_mm"]');
  await reach.fill('');
  await reach.focus();
  await page.keyboard.type('-470');
  assert.equal(await reach.inputValue(), '-470', 'the field got the minus');
  for (const key of ['ArrowLeft', 'ArrowUp', 'Home', '+', '0', '=']) await page.keyboard.press(key);
  assert.equal(await reach.inputValue(), '+0=-470', 'the field got its keys: Home went to its start');
  await reach.fill('470');
  await settled(page);
  assert.equal(await viewBox(page), fit, 'the drawing did not zoom or move');
  assert.equal(await page.locator('#drawing.zoomed').count(), 0);
  assert.deepEqual(problems, []);
  await context.close();
});

test('phone held sideways 740×360: a zoomed drawing from the keyboard, screenshot', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 740, height: 360 });
  await shot(page, `${SHOTS}/keys-landscape-740x360.png`);
  const fit = await viewBox(page);
  await page.locator('#show-ghost').focus();
  await page.keyboard.press('Tab');
  assert.equal(await page.evaluate(() => document.activeElement.id), 'drawing');
  await page.keyboard.press('+');
  await page.keyboard.press('+');
  const [, , w] = numbers(await viewBox(page));
  assert.ok(Math.abs(w - numbers(fit)[2] * 0.64) <= 0.11, `zoomed 1.25² : ${w}`);
  await shot(page, `${SHOTS}/keys-landscape-740x360-zoomed.png`);
  await page.keyboard.press('0');
  assert.equal(await viewBox(page), fit);
  assert.deepEqual(problems, []);
  await context.close();
});

test('desk: a click on the drawing does not give it the keys (only Tab does): the arrows still scroll the page', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  const fit = await viewBox(page);
  await page.locator('#drawing').click({ position: { x: 40, y: 40 } });
  assert.notEqual(await page.evaluate(() => document.activeElement?.id), 'drawing', 'a click leaves the focus where it was');
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('Home');
  assert.equal(await viewBox(page), fit, 'the arrows and Home after a click do not move the drawing');
  // Once it has the focus (Tab), a click keeps it there.
  await page.locator('#show-ghost').focus();
  await page.keyboard.press('Tab');
  await page.locator('#drawing').click({ position: { x: 40, y: 40 } });
  assert.equal(await page.evaluate(() => document.activeElement?.id), 'drawing');
  assert.deepEqual(problems, []);
  await context.close();
});

test('desk: from the top, the keyboard reaches the chart box and the inputs by the page\'s links, shown when focused', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  const focused = () => page.evaluate(() => ({ text: document.activeElement.textContent, id: document.activeElement.id }));
  await page.keyboard.press('Tab');
  assert.equal((await focused()).text, 'Skip to the inputs');
  await page.keyboard.press('Tab');
  assert.equal((await focused()).text, 'Numbers');
  // Hidden until focused, then on the screen and not clipped.
  const box = await page.locator('.jump a', { hasText: 'Numbers' }).boundingBox();
  assert.ok(box && box.width > 40 && box.height >= 44 && box.y >= 0, JSON.stringify(box));
  assert.equal(await page.locator('.jump').evaluate((n) => getComputedStyle(n).clipPath), 'none');
  await page.keyboard.press('Tab');
  assert.equal((await focused()).text, 'Paste a chart');
  await page.keyboard.press('Enter');
  await page.keyboard.press('Tab');
  assert.equal((await focused()).id, 'chart-text', 'the next Tab is in the chart box, not 60 names later');
  // Left, the links hide again.
  assert.notEqual(await page.locator('.jump').evaluate((n) => getComputedStyle(n).clipPath), 'none');
  assert.deepEqual(problems, []);
  await context.close();
});
