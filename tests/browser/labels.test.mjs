// The drawing's labels (dimensions and the handling limits on the centre-of-mass lines) at first
// view: readable on a phone, the same size as before on a desk, never on each other, never on
// the bike's tubes, fork, tyres, cockpit, seat or cranks, nor on the rider shown.
//
// A label's size here is its type's size on the screen: the computed font size (mm of drawing)
// times the drawing's scale (CSS px per mm). Its bounding box is about 1.16 em tall (the font's
// ascent and descent), so the old 9.5 px type on a 360 px phone measured an 11 px box.
// Before the phone type: 64 mm everywhere, 9.5 px (box 11 px) at 360×740, 14.1 px (box 16 px)
// at 1280×800. Before the labels were placed (crates/draw layout.rs): up to 80 mm, 11.9 px at
// 360×740, 10 px at 568×320, and reach on the top tube, descent on the fork and front tyre.
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

/**
 * The drawn parts each shown label's ink lies on, as "label on part" (none: []). A label's ink is
 * the lower 1 em of its box (DejaVu Sans's capitals and digits reach 0.73 em above the baseline,
 * its box 0.93), grown by the label's halo (9 mm of drawing, web/style.css) less half a pixel;
 * a part is its polyline or circle with its stroke, in screen pixels: the ridden bike's tubes,
 * fork, headset, cockpit, seatpost, saddle and cranks, its tyres, and the shown rider's limbs
 * and head.
 */
function onParts(page) {
  return page.evaluate(() => {
    const svg = document.querySelector('#drawing svg');
    const m = svg.getScreenCTM();
    const scale = m.a;
    const at = ([x, y]) => [m.a * x + m.c * y + m.e, m.b * x + m.d * y + m.f];
    const shown = (el) => el.getClientRects().length > 0 || el.closest('marker');
    const visible = (el) => getComputedStyle(el.closest('g.posture') ?? svg).display !== 'none';
    const half = (el) => (Number.parseFloat(getComputedStyle(el).strokeWidth) || 0) * scale / 2;
    const pointsOf = (el) => el.getAttribute('points').trim().split(/\s+/).map((p) => at(p.split(',').map(Number)));
    const parts = [];
    const bike = '.bike.ridden';
    for (const el of svg.querySelectorAll(`${bike} polyline.tube, ${bike} polyline.fork, ${bike} polyline.headset, ${bike} polyline.spacers, ${bike} polyline.stem-clamp, ${bike} polyline.stem, ${bike} polyline.bar, ${bike} polyline.post, ${bike} polyline.saddle, ${bike} polyline.crank, .posture .rider polyline.limb`)) {
      if (!shown(el) || !visible(el)) continue;
      const pts = pointsOf(el);
      for (let i = 1; i < pts.length; i++) parts.push({ name: `${el.dataset.k}`, seg: [pts[i - 1], pts[i]], half: half(el) });
    }
    for (const c of svg.querySelectorAll(`${bike} circle.tyre, ${bike} circle.grip, .posture .rider circle.head`)) {
      if (!visible(c)) continue;
      const anchor = svg.querySelector(`polyline[data-k="${c.dataset.k.replace(/\.r$/, '')}"]`);
      const centre = pointsOf(anchor)[0];
      const r = Number(c.getAttribute('r')) * scale;
      const filled = !c.classList.contains('tyre');
      parts.push({ name: c.dataset.k, ring: [centre, r], half: filled ? r : half(c), filled });
    }
    const pointBox = ([x, y], b) => Math.hypot(Math.max(b[0] - x, 0, x - b[2]), Math.max(b[1] - y, 0, y - b[3]));
    // Distance from a segment to a box: a ternary search along the segment (the distance is convex).
    const segBox = ([a, b], box) => {
      const f = (t) => pointBox([a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t], box);
      let [lo, hi] = [0, 1];
      for (let i = 0; i < 80; i++) {
        const m1 = lo + (hi - lo) / 3; const m2 = hi - (hi - lo) / 3;
        if (f(m1) <= f(m2)) hi = m2; else lo = m1;
      }
      return Math.min(f(lo), f(0), f(1));
    };
    const out = [];
    for (const t of svg.querySelectorAll('text.label')) {
      const r = t.getBoundingClientRect();
      if (r.width === 0) continue;
      const em = Number.parseFloat(getComputedStyle(t).fontSize) * scale;
      const halo = 9 * scale - 0.5;
      const ink = [r.left - halo, r.bottom - em - halo, r.right + halo, r.bottom + halo];
      for (const p of parts) {
        let hit;
        if (p.seg) hit = segBox(p.seg, ink) < p.half;
        else {
          const [c, rad] = p.ring;
          const near = pointBox(c, ink);
          const far = Math.max(...[[ink[0], ink[1]], [ink[2], ink[1]], [ink[2], ink[3]], [ink[0], ink[3]]].map(([x, y]) => Math.hypot(x - c[0], y - c[1])));
          hit = p.filled ? near < rad : near < rad + p.half && far > rad - p.half;
        }
        if (hit) out.push(`${t.dataset.k} on ${p.name}`);
      }
    }
    return out;
  });
}

/** Every check of one view: the count of labels, their least type size, no overlaps, inside the
 * drawing, on no part; returns the labels. */
async function checkView(page, name, { count, minPx }) {
  const { shown, drawing } = await labels(page);
  assert.equal(shown.length, count, `${name}: ${shown.map((l) => l.key)}`);
  const small = shown.filter((l) => l.px < minPx).map((l) => `${l.key} ${round(l.px)} px`);
  assert.deepEqual(small, [], `${name}: type under ${minPx} px`);
  assert.deepEqual(overlaps(shown), [], `${name}: labels overlap`);
  const out = outside(shown, drawing);
  assert.deepEqual(out.map((l) => `${l.key} [${l.box.map(round)}]`), [], `${name}: outside the drawing [${drawing}]`);
  assert.deepEqual(await onParts(page), [], `${name}: labels on the bike or the rider`);
  return { shown, drawing };
}

const VIEWS = [
  { posture: 'seated', dims: true },
  { posture: 'standing', dims: true },
  { posture: 'seated', dims: false },
  { posture: 'standing', dims: false },
];

const shotName = (bike, width, height, v) => `${SHOTS}/labels-${bike}-${width}x${height}-${v.posture}-${v.dims ? 'dims' : 'no-dims'}.png`;

test('phone 360×740: labels at least 12 px, inside the drawing, none on another, on the bike or on the rider', T, async (t) => {
  const { page, context, problems } = await openPage(env, { width: 360, height: 740 });
  for (const v of VIEWS) {
    await view(page, v);
    const name = `${v.posture}${v.dims ? ' with dimensions' : ''}`;
    const { shown } = await checkView(page, name, { count: v.dims ? 9 : 3, minPx: 12 });
    t.diagnostic(`360 ${name}: type ${round(Math.min(...shown.map((l) => l.px)))} px, box ${round(shown[0].box[3] - shown[0].box[1])} px tall`);
    await shot(page, shotName('demo', 360, 740, v), {}, page.locator('#drawing'));
  }
  assert.deepEqual(problems, []);
  await context.close();
});

// The smallest phone upright: inside its card the drawing's box was 294 px, under the 307 px
// where the type reaches its largest, 86 mm (crates/draw LABEL_EM_MAX_MM): 11.5 px. 90 mm cannot
// be placed cleanly (lib.rs), so under 334 px the drawing spans its card (style.css): 310 px,
// 12.1 px.
test('phone 320×568: labels at least 12 px, inside the drawing, none on another, on the bike or on the rider', T, async (t) => {
  const { page, context, problems } = await openPage(env, { width: 320, height: 568 });
  for (const v of VIEWS) {
    await view(page, v);
    const name = `${v.posture}${v.dims ? ' with dimensions' : ''}`;
    const { shown, drawing } = await checkView(page, name, { count: v.dims ? 9 : 3, minPx: 12 });
    t.diagnostic(`320 ${name}: type ${round(Math.min(...shown.map((l) => l.px)))} px, drawing ${round(drawing[2] - drawing[0])} px`);
  }
  assert.deepEqual(problems, []);
  await context.close();
});

// Larger phones held upright: the drawing's box 364 to 404 px wide, where the type once fell to
// 11.7 px (style.css: the type's size is a straight line in the box's size, kept above 12 px).
for (const [width, height] of [[390, 844], [412, 915], [430, 932]]) {
  test(`phone ${width}×${height}: labels at least 12 px, inside the drawing, none on another, on the bike or on the rider`, T, async (t) => {
    const { page, context, problems } = await openPage(env, { width, height });
    for (const v of VIEWS) {
      await view(page, v);
      const name = `${v.posture}${v.dims ? ' with dimensions' : ''}`;
      const { shown } = await checkView(page, name, { count: v.dims ? 9 : 3, minPx: 12 });
      t.diagnostic(`${width} ${name}: type ${round(Math.min(...shown.map((l) => l.px)))} px`);
    }
    assert.deepEqual(problems, []);
    await context.close();
  });
}

// A phone held sideways: the drawing's box is as tall as the screen, beside the masthead and the
// toolbar (style.css). With both above it the box was 232 px tall at 740×360 and the type 8.2 px;
// at 568×320, with the posture's buttons side by side, the box was 280 px wide and the type 10 px.
for (const [width, height] of [[568, 320], [640, 360], [740, 360]]) {
  test(`phone held sideways ${width}×${height}: labels at least 12 px, inside the drawing, none on another, on the bike or on the rider`, T, async (t) => {
    const { page, context, problems } = await openPage(env, { width, height });
    for (const v of VIEWS) {
      await view(page, v);
      const name = `${v.posture}${v.dims ? ' with dimensions' : ''}`;
      const { shown, drawing } = await checkView(page, name, { count: v.dims ? 9 : 3, minPx: 12 });
      assert.ok(drawing[1] >= 0 && drawing[3] <= height, `${name}: the drawing [${drawing}] on the screen`);
      // The label's height on the screen: its box (the font's ascent and descent, 1.16 em).
      const low = shown.filter((l) => l.box[3] - l.box[1] < 13.9).map((l) => `${l.key} ${round(l.box[3] - l.box[1])} px`);
      assert.deepEqual(low, [], `${name}: label boxes under 14 px tall`);
      t.diagnostic(`${width}×${height} ${name}: type ${round(Math.min(...shown.map((l) => l.px)))} px, box ${round(Math.min(...shown.map((l) => l.box[3] - l.box[1])))} px tall`);
      await shot(page, shotName('demo', width, height, v), {}, page.locator('#drawing'));
    }
    await shot(page, `${SHOTS}/labels-${width}x${height}-page.png`);
    assert.deepEqual(problems, []);
    await context.close();
  });
}

test('desk 1280×800: labels no bigger than before (14.1 px type, 16 px box), none on another, on the bike or on the rider', T, async (t) => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  for (const v of VIEWS) {
    await view(page, v);
    const name = `${v.posture}${v.dims ? ' with dimensions' : ''}`;
    const { shown } = await checkView(page, name, { count: v.dims ? 9 : 3, minPx: 12 });
    const big = shown.filter((l) => l.px > 14.12 || l.box[3] - l.box[1] > 16.01)
      .map((l) => `${l.key} ${round(l.px)} px, box ${round(l.box[3] - l.box[1])} px`);
    assert.deepEqual(big, [], `${name}: bigger than before`);
    t.diagnostic(`1280 ${name}: type ${round(Math.max(...shown.map((l) => l.px)))} px, box ${round(shown[0].box[3] - shown[0].box[1])} px tall`);
    await shot(page, shotName('demo', 1280, 800, v), {}, page.locator('#drawing'));
  }
  assert.deepEqual(problems, []);
  await context.close();
});

// The drop-bar pair's first bike: its hoods put the grip far forward, and "BB to grip" ran off the
// drawing's edge until the view box reached past the label (crates/draw view::fit); its tyres are
// too close for BB height's label between them, which goes under the ground. Standing, its grips
// are out of the standing figure's reach: no rider and no limits, the dimensions alone.
for (const [width, height] of [[360, 740], [568, 320]]) {
  test(`${width}×${height}: a road bike with its grip far forward keeps every label inside the drawing, off the bike and the rider`, T, async () => {
    const hash = readFileSync(`${ROOT}tests/links/v1-drop-bar-pair.txt`, 'utf8').trim();
    const { page, context, problems } = await openPage(env, { width, height, hash });
    for (const v of VIEWS) {
      await view(page, v);
      const name = `road ${v.posture}${v.dims ? ' with dimensions' : ''}`;
      const count = (v.dims ? 6 : 0) + (v.posture === 'seated' ? 3 : 0);
      const { shown } = await checkView(page, name, { count, minPx: width === 360 ? 11.9 : 11.4 });
      if (v.dims) assert.ok(shown.some((l) => l.key === 'dim-bb_to_grip_mm'), shown.map((l) => l.key).join());
      await shot(page, shotName('road', width, height, v), {}, page.locator('#drawing'));
    }
    assert.deepEqual(problems, []);
    await context.close();
  });
}

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
