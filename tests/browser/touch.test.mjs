// Browser tests of the drawing's gestures (web/ui/zoom.js): the drawing never traps scrolling.
// On a touch screen one finger over the drawing scrolls the page until the drawing is zoomed,
// two fingers pinch-zoom it, and once zoomed one finger moves it; a mouse wheel scrolls the page
// and zooms the drawing only with Ctrl held (as a trackpad pinch sends it).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { startAll, openPage } from './harness.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 60000 };

/** The page on a 360×740 touch phone, ready; page errors are collected in `problems`. */
async function openTouchPage() {
  const context = await env.browser.newContext({ viewport: { width: 360, height: 740 }, hasTouch: true, isMobile: true });
  const page = await context.newPage();
  const problems = [];
  page.on('pageerror', (e) => problems.push(e.message));
  await page.goto(env.base);
  await page.waitForSelector('html[data-ready="true"]', { timeout: 15000 });
  return { context, page, problems };
}

test('phone: one finger scrolls the page over the drawing, two fingers zoom, then one finger moves it', T, async () => {
  const { context, page, problems } = await openTouchPage();
  const cdp = await context.newCDPSession(page);
  const svg = page.locator('#drawing svg');
  const touch = (type, points) => cdp.send('Input.dispatchTouchEvent', {
    type, touchPoints: points.map(([x, y], id) => ({ x, y, id })),
  });
  // Fingers from `from` to `to` (one [x, y] per finger) in 10 steps a frame apart.
  async function swipe(from, to) {
    await touch('touchStart', from);
    for (let i = 1; i <= 10; i += 1) {
      await touch('touchMove', from.map(([x, y], k) => [x + ((to[k][0] - x) * i) / 10, y + ((to[k][1] - y) * i) / 10]));
      await page.waitForTimeout(16);
    }
    await touch('touchEnd', []);
    await page.waitForTimeout(300);
  }
  const middle = async () => {
    const b = await svg.boundingBox();
    return [b.x + b.width / 2, b.y + b.height / 2];
  };
  const fit = await svg.getAttribute('viewBox');
  let [x, y] = await middle();
  await swipe([[x, y + 100]], [[x, y - 150]]);
  assert.ok(await page.evaluate(() => scrollY) > 100, 'the page scrolled');
  assert.equal(await svg.getAttribute('viewBox'), fit, 'the drawing did not move');

  // Back to the top once the swipe's fling has stopped.
  await page.waitForFunction(() => new Promise((ok) => {
    const at = scrollY;
    setTimeout(() => ok(scrollY === at), 200);
  }), null, { timeout: 5000 });
  await page.evaluate(() => scrollTo(0, 0));
  await page.waitForTimeout(200);
  [x, y] = await middle();
  await swipe([[x - 30, y], [x + 30, y]], [[x - 120, y], [x + 120, y]]);
  const zoomed = (await svg.getAttribute('viewBox')).split(' ').map(Number);
  const width = Number(fit.split(' ')[2]);
  assert.ok(zoomed[2] < width / 2, `pinched 4× apart: ${fit} → ${zoomed.join(' ')}`);
  assert.equal(await page.evaluate(() => scrollY), 0, 'a pinch does not scroll');

  await swipe([[x, y]], [[x + 80, y + 60]]);
  const moved = (await svg.getAttribute('viewBox')).split(' ').map(Number);
  assert.ok(moved[0] < zoomed[0] && moved[1] < zoomed[1], `one finger moved the zoomed drawing: ${zoomed} → ${moved}`);
  assert.equal(moved[2], zoomed[2], 'moving keeps the zoom');
  assert.equal(await page.evaluate(() => scrollY), 0, 'a zoomed drawing keeps the finger');
  assert.deepEqual(problems, []);
  await context.close();
});

test('desk: a plain wheel over the drawing scrolls, Ctrl and wheel zooms', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  const svg = page.locator('#drawing svg');
  const fit = await svg.getAttribute('viewBox');
  const box = await svg.boundingBox();
  // A drag on the whole bike (not zoomed) moves nothing: only a zoomed drawing moves.
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width / 2 + 60, box.y + box.height / 2 + 30, { steps: 4 });
  await page.mouse.up();
  assert.equal(await svg.getAttribute('viewBox'), fit, 'a drag does not move the whole bike');
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.wheel(0, 300);
  await page.waitForTimeout(300);
  assert.equal(await svg.getAttribute('viewBox'), fit, 'a plain wheel does not zoom');
  const scrolled = await page.evaluate(() => scrollY + document.querySelector('.view-col').scrollTop);
  assert.ok(scrolled > 0, 'a plain wheel scrolls the numbers or the page');
  const now = await svg.boundingBox(); // the drawing scrolled with the numbers
  await page.mouse.move(now.x + now.width / 2, now.y + now.height / 2);
  await page.keyboard.down('Control');
  await page.mouse.wheel(0, -300);
  await page.keyboard.up('Control');
  assert.notEqual(await svg.getAttribute('viewBox'), fit, 'Ctrl and wheel zooms');
  assert.deepEqual(problems, []);
  await context.close();
});

test('phone: a tap on a number in the drawing says what it is under the drawing; a drag does not', T, async () => {
  const { context, page, problems } = await openTouchPage();
  await page.locator('label.toggle:has(#show-dims)').tap();
  const def = page.locator('#drawing-def');
  const centre = async (k) => {
    const b = await page.locator(`#drawing svg text[data-k="${k}"]`).boundingBox();
    return [b.x + b.width / 2, b.y + b.height / 2];
  };
  assert.equal(await def.isVisible(), false);
  // The catalogue's words for reach (crates/kernel catalogue.rs), as the tables say them.
  await page.touchscreen.tap(...(await centre('dim-reach_mm')));
  await page.waitForFunction(() => !document.getElementById('drawing-def').hidden, null, { timeout: 3000 });
  assert.equal(await def.textContent(), 'Reach Horizontal distance from the bottom bracket centre to the centre of the top of the head tube.');
  assert.equal(await def.locator('strong').textContent(), 'Reach');
  // A limit on the centre-of-mass lines names its posture (the glossary's braking limit).
  await page.touchscreen.tap(...(await centre('seated-braking')));
  await page.waitForFunction(() => /^Braking limit, seated Braking on level ground/.test(document.getElementById('drawing-def').textContent), null, { timeout: 3000 });
  // The same label again takes it away.
  await page.touchscreen.tap(...(await centre('seated-braking')));
  await page.waitForFunction(() => document.getElementById('drawing-def').hidden, null, { timeout: 3000 });
  // A drag that starts on a label is not a tap (the one finger scrolls the page).
  const cdp = await context.newCDPSession(page);
  const [x, y] = await centre('dim-stack_mm');
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: [{ x, y, id: 0 }] });
  for (let i = 1; i <= 5; i += 1) {
    await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: [{ x, y: y - 12 * i, id: 0 }] });
  }
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });
  await page.waitForTimeout(300);
  assert.equal(await def.isVisible(), false);
  assert.deepEqual(problems, []);
  await context.close();
});

test('desk: hovering a number in the drawing says what it is', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  await page.locator('#drawing svg text[data-k="seated-climb"]').hover();
  await page.waitForFunction(() => /^Steepest static climb, seated Steepest uphill slope/.test(document.getElementById('drawing-def').textContent), null, { timeout: 3000 });
  // A click on the label the hover showed keeps it (a mouse's click is not a second tap).
  await page.locator('#drawing svg text[data-k="seated-climb"]').click();
  await page.waitForTimeout(200);
  assert.equal(await page.locator('#drawing-def').isVisible(), true);
  assert.deepEqual(problems, []);
  await context.close();
});

test('the hint under the drawing says its keys at a desk, not on a touch phone', T, async () => {
  const desk = await openPage(env, { width: 1280, height: 800 });
  assert.match(await desk.page.locator('.hint .keys').innerText(), /\+ and − zoom, arrows move it, 0 fits/);
  assert.ok((await desk.page.locator('.hint .keys').evaluate((e) => e.parentElement.innerText)).includes('Keys, with the drawing focused'));
  await desk.context.close();
  const phone = await openTouchPage();
  const text = await phone.page.locator('.hint .keys').evaluate((e) => e.parentElement.innerText);
  assert.ok(!text.includes('Keys'), `a touch phone's hint has no keys: ${text}`);
  assert.match(text, /Pinch/);
  assert.match(await phone.page.locator('#drawing').getAttribute('aria-label'), /\+|zoom/i, 'the drawing still names its keys to assistive technology');
  assert.deepEqual(phone.problems, []);
  await phone.context.close();
});
