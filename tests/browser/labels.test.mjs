// The drawing's labels (dimensions and the handling limits on the centre-of-mass lines) at first
// view: readable on a phone, the same size as before on a desk, never on each other.
//
// A label's size here is its type's size on the screen: the computed font size (mm of drawing)
// times the drawing's scale (CSS px per mm). Its bounding box is about 1.16 em tall (the font's
// ascent and descent), so the old 9.5 px type on a 360 px phone measured an 11 px box.
// Before the phone type: 64 mm everywhere, 9.5 px (box 11 px) at 360×740, 14.1 px (box 16 px)
// at 1280×800.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { startAll, openPage, settled, shot, SHOTS, ROOT } from './harness.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 60000 };

/** Shows or hides the dimensions and picks the posture, as the toolbar does. */
async function view(page, { posture, dims }) {
  await page.locator(`label[for="posture-${posture}"]`).click();
  if ((await page.locator('#show-dims').isChecked()) !== dims) {
    await page.locator('label.toggle:has(#show-dims)').click();
  }
  await settled(page);
}

/** Every label on the screen: key, type size in CSS px, bounding box; and the drawing's box. */
function labels(page) {
  return page.evaluate(() => {
    const svg = document.querySelector('#drawing svg');
    const scale = svg.getScreenCTM().a;
    const shown = [...svg.querySelectorAll('text.label')]
      .map((t) => ({ t, r: t.getBoundingClientRect() }))
      .filter(({ r }) => r.width > 0)
      .map(({ t, r }) => ({
        key: t.dataset.k,
        px: Number.parseFloat(getComputedStyle(t).fontSize) * scale,
        box: [r.left, r.top, r.right, r.bottom],
      }));
    const d = svg.getBoundingClientRect();
    return { shown, drawing: [d.left, d.top, d.right, d.bottom] };
  });
}

const round = (v) => Math.round(v * 100) / 100;

/** Pairs of labels whose boxes overlap (touching edges do not count). */
function overlaps(shown) {
  const out = [];
  shown.forEach((a, i) => shown.slice(i + 1).forEach((b) => {
    const apart = a.box[2] <= b.box[0] || b.box[2] <= a.box[0] || a.box[3] <= b.box[1] || b.box[3] <= a.box[1];
    if (!apart) out.push(`${a.key} [${a.box.map(round)}] × ${b.key} [${b.box.map(round)}]`);
  }));
  return out;
}

/** Labels whose boxes reach outside the drawing's box. */
function outside(shown, drawing) {
  return shown.filter(({ box: b }) => b[0] < drawing[0] || b[2] > drawing[2] || b[1] < drawing[1] || b[3] > drawing[3]);
}

const VIEWS = [
  { posture: 'seated', dims: true },
  { posture: 'standing', dims: true },
  { posture: 'seated', dims: false },
  { posture: 'standing', dims: false },
];

test('phone 360×740: labels at least 11 px, inside the drawing, none on another', T, async (t) => {
  const { page, context, problems } = await openPage(env, { width: 360, height: 740 });
  for (const v of VIEWS) {
    await view(page, v);
    const { shown, drawing } = await labels(page);
    const name = `${v.posture}${v.dims ? ' with dimensions' : ''}`;
    assert.equal(shown.length, v.dims ? 9 : 3, `${name}: ${shown.map((l) => l.key)}`);
    const small = shown.filter((l) => l.px < 11).map((l) => `${l.key} ${round(l.px)} px`);
    assert.deepEqual(small, [], `${name}: type under 11 px`);
    assert.deepEqual(overlaps(shown), [], `${name}: labels overlap`);
    const out = outside(shown, drawing);
    assert.deepEqual(out.map((l) => `${l.key} [${l.box.map(round)}]`), [], `${name}: outside the drawing [${drawing}]`);
    t.diagnostic(`360 ${name}: type ${round(Math.min(...shown.map((l) => l.px)))} px, box ${round(shown[0].box[3] - shown[0].box[1])} px tall`);
    await shot(page, `${SHOTS}/labels-360-${v.posture}-${v.dims ? 'dims' : 'no-dims'}.png`, {}, page.locator('#drawing'));
  }
  assert.deepEqual(problems, []);
  await context.close();
});

// A phone held sideways: the drawing's box is as tall as the screen, beside the masthead and the
// toolbar (style.css). With both above it the box was 232 px tall at 740×360 and the type 8.2 px.
for (const [width, height] of [[740, 360], [640, 360]]) {
  test(`phone held sideways ${width}×${height}: labels at least 12 px, inside the drawing, none on another`, T, async (t) => {
    const { page, context, problems } = await openPage(env, { width, height });
    for (const v of VIEWS) {
      await view(page, v);
      const { shown, drawing } = await labels(page);
      const name = `${v.posture}${v.dims ? ' with dimensions' : ''}`;
      assert.equal(shown.length, v.dims ? 9 : 3, `${name}: ${shown.map((l) => l.key)}`);
      const small = shown.filter((l) => l.px < 12).map((l) => `${l.key} ${round(l.px)} px`);
      assert.deepEqual(small, [], `${name}: type under 12 px`);
      assert.deepEqual(overlaps(shown), [], `${name}: labels overlap`);
      const out = outside(shown, drawing);
      assert.deepEqual(out.map((l) => `${l.key} [${l.box.map(round)}]`), [], `${name}: outside the drawing [${drawing}]`);
      assert.ok(drawing[1] >= 0 && drawing[3] <= height, `${name}: the drawing [${drawing}] on the screen`);
      t.diagnostic(`${width}×${height} ${name}: type ${round(Math.min(...shown.map((l) => l.px)))} px, box ${round(shown[0].box[3] - shown[0].box[1])} px tall`);
    }
    await shot(page, `${SHOTS}/labels-${width}x${height}-standing-no-dims.png`);
    assert.deepEqual(problems, []);
    await context.close();
  });
}

test('desk 1280×800: labels no bigger than before (14.1 px type, 16 px box)', T, async (t) => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  for (const v of VIEWS) {
    await view(page, v);
    const { shown } = await labels(page);
    const name = `${v.posture}${v.dims ? ' with dimensions' : ''}`;
    assert.equal(shown.length, v.dims ? 9 : 3, `${name}: ${shown.map((l) => l.key)}`);
    const big = shown.filter((l) => l.px > 14.12 || l.box[3] - l.box[1] > 16.01)
      .map((l) => `${l.key} ${round(l.px)} px, box ${round(l.box[3] - l.box[1])} px`);
    assert.deepEqual(big, [], `${name}: bigger than before`);
    assert.deepEqual(overlaps(shown), [], `${name}: labels overlap`);
    t.diagnostic(`1280 ${name}: type ${round(Math.max(...shown.map((l) => l.px)))} px, box ${round(shown[0].box[3] - shown[0].box[1])} px tall`);
    await shot(page, `${SHOTS}/labels-1280-${v.posture}-${v.dims ? 'dims' : 'no-dims'}.png`, {}, page.locator('#drawing'));
  }
  assert.deepEqual(problems, []);
  await context.close();
});

test('phone 360×740: a road bike with its grip far forward keeps every label inside the drawing', T, async () => {
  // The drop-bar pair's first bike: its hoods put the grip far forward, and "BB to grip" ran off
  // the drawing's edge until the view box reached past the label (crates/draw view::fit).
  const hash = readFileSync(`${ROOT}tests/links/v1-drop-bar-pair.txt`, 'utf8').trim();
  const { page, context, problems } = await openPage(env, { width: 360, height: 740, hash });
  for (const v of VIEWS.filter((x) => x.dims)) {
    await view(page, v);
    const { shown, drawing } = await labels(page);
    assert.ok(shown.some((l) => l.key === 'dim-bb_to_grip_mm'), shown.map((l) => l.key).join());
    const out = outside(shown, drawing);
    assert.deepEqual(out.map((l) => `${l.key} [${l.box.map(round)}]`), [], `${v.posture}: outside the drawing [${drawing}]`);
    assert.deepEqual(overlaps(shown), [], `${v.posture}: labels overlap`);
    await shot(page, `${SHOTS}/labels-360-road-${v.posture}.png`, {}, page.locator('#drawing'));
  }
  assert.deepEqual(problems, []);
  await context.close();
});

test('phone 360×740: a posture drawn without its rider says why under the drawing', T, async () => {
  // The drop-bar pair's first bike: standing, its grips are out of the standing figure's reach.
  const hash = readFileSync(`${ROOT}tests/links/v1-drop-bar-pair.txt`, 'utf8').trim();
  const { page, context, problems } = await openPage(env, { width: 360, height: 740, hash });
  const note = page.locator('#posture-note');
  await view(page, { posture: 'seated', dims: false });
  assert.equal(await note.isHidden(), true, 'the seated rider is drawn: nothing to say');
  await view(page, { posture: 'standing', dims: false });
  assert.equal(await page.locator('#drawing svg .posture.standing .rider').count(), 0, 'no standing rider');
  assert.match(await note.textContent(), /^Standing, the grips are \d+ mm beyond reach; the standing figure is left out\.$/);
  await shot(page, `${SHOTS}/page-phone-posture-note.png`, { clip: { x: 0, y: 0, width: 360, height: 740 } });
  // With a field in error the last good bike stays drawn, and the note follows the posture shown.
  await page.fill('input[name="frame.reach_mm"]', 'abc');
  await view(page, { posture: 'seated', dims: false });
  assert.equal(await note.isHidden(), true, 'seated: its rider is drawn');
  await view(page, { posture: 'standing', dims: false });
  assert.match(await note.textContent(), /^Standing, the grips are/);
  await page.fill('input[name="frame.reach_mm"]', '380');
  // An edit that brings the grips within reach (a much shorter stem and reach) takes it away.
  await page.fill('input[name="setup.stem_mm"]', '40');
  await page.fill('input[name="frame.reach_mm"]', '300');
  await settled(page);
  assert.equal(await note.isHidden(), true, await note.textContent());
  await view(page, { posture: 'seated', dims: false });
  assert.equal(await note.isHidden(), true);
  // A seated rider drawn with a pedal out of reach at one crank angle (a high saddle): the
  // warnings list says it; the note does not, as the rider is there.
  await page.fill('input[name="setup.saddle_height_mm"]', '820');
  await settled(page);
  const warnings = await page.locator('#warnings').textContent();
  assert.match(warnings, /Seated, the pedal at bottom dead centre is \d+ mm beyond reach/);
  assert.equal(await page.locator('#drawing svg .posture.seated .rider').count(), 1, 'the seated rider is drawn');
  assert.equal(await note.isHidden(), true, await note.textContent());
  assert.deepEqual(problems, []);
  await context.close();
});
