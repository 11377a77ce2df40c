// Browser tests of the drawing's in-place update (crates/draw Drawing::patch): an edit that keeps
// the drawing's structure patches the shown SVG (the same nodes, new values) and gives exactly
// the markup a fresh page draws for the same form; a part that appears or goes (the cockpit and
// rider without a stem) replaces the drawing; a person's zoom survives a patch and "Fit" goes to the new fit. Also saves close-up
// screenshots of the drawing (seated, standing, dimensions, a fork change with its ghost).
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { startAll, openPage, settled, linkOf, SHOTS, ROOT } from './harness.mjs';
import { zoomIn, showEveryLayer } from './page-helpers.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 60000 };
const SIZES = [['phone', 360, 740], ['desk', 1280, 800]];

const d = (page, key) => page.getAttribute(`#drawing [data-k="${key}"]`, 'points');
const ghostOf = (page) => page.evaluate(() => [...document.querySelectorAll('#drawing .ghost polyline')].map((p) => p.getAttribute('points')).join(' | '));
// The drawing's markup but for its view box and the ground line drawn across it: a page keeps
// the view box it shows while the bike still fits in it (crates/draw view.rs), where a fresh page
// opened from the same link fits the bike afresh.
const markup = (page) => page.locator('#drawing svg').evaluate((s) => s.outerHTML
  .replace(/ data-fit="[^"]*"/, '').replace(/ viewBox="[^"]*"/, '').replace(/(data-k="ground" points=")[^"]*"/, '$1'));
const viewBox = (page) => page.locator('#drawing svg').evaluate((s) => s.getAttribute('viewBox').split(' ').map(Number));
/** The kept view box holds the fresh page's fit and is at most 100 mm wider and taller. */
async function keepsTheFit(page, fresh) {
  const [[x, y, w, h], [fx, fy, fw, fh]] = [await viewBox(page), await viewBox(fresh)];
  assert.ok(x <= fx && y <= fy && x + w >= fx + fw && y + h >= fy + fh, `${[x, y, w, h]} holds ${[fx, fy, fw, fh]}`);
  assert.ok(w - fw <= 100 && h - fh <= 100, `${[x, y, w, h]} near ${[fx, fy, fw, fh]}`);
}

for (const [name, width, height] of SIZES) {
  test(`${name}: an edit patches the shown drawing in place`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    await page.evaluate(() => {
      window.marked = {
        svg: document.querySelector('#drawing svg'),
        fork: document.querySelector('#drawing [data-k="ridden-fork-leg"]'),
        reach: document.querySelector('#drawing [data-k="dim-reach_mm"]'),
      };
    });
    const fork = await d(page, 'ridden-fork-leg');
    const ghost = await ghostOf(page);
    const shownBox = await viewBox(page);
    await page.fill('input[name="frame.reach_mm"]', '460');
    await page.waitForFunction((old) => document.querySelector('#drawing [data-k="ridden-fork-leg"]').getAttribute('points') !== old, fork, { timeout: 5000 });
    const same = await page.evaluate(() => ({
      svg: document.querySelector('#drawing svg') === window.marked.svg,
      fork: document.querySelector('#drawing [data-k="ridden-fork-leg"]') === window.marked.fork,
      reach: document.querySelector('#drawing [data-k="dim-reach_mm"]') === window.marked.reach,
      reachText: window.marked.reach.textContent,
    }));
    // The reach label is in the hidden dimensions layer: its new words wait until it is shown.
    assert.deepEqual(same, { svg: true, fork: true, reach: true, reachText: 'Reach 470' });
    assert.notEqual(await d(page, 'ridden-fork-leg'), fork);
    assert.notEqual(await ghostOf(page), ghost, 'the stock frame moved with its reach');
    // The bike still fits in the view box shown (its own fit is 50 mm narrower: the front tyre
    // moved back 10 mm, past a step of the fit): it stays.
    assert.deepEqual(await viewBox(page), shownBox, 'the view box is kept');
    await page.locator('label.toggle:has(#show-dims)').click();
    assert.equal(await page.evaluate(() => window.marked.reach.textContent), 'Reach 460');
    await page.locator('label.toggle:has(#show-dims)').click();
    await showEveryLayer(page);
    // Every layer shown once: the patched drawing is exactly what a fresh page draws for the
    // same form, in the view box it keeps.
    const url = await linkOf(page);
    const fresh = await openPage(env, { width, height, hash: new URL(url).hash });
    assert.equal(await markup(fresh.page), await markup(page));
    await keepsTheFit(page, fresh.page);
    assert.notDeepEqual(await viewBox(fresh.page), shownBox, 'a fresh page fits the bike afresh');
    assert.deepEqual([...problems, ...fresh.problems], []);
    await fresh.context.close();
    await context.close();
  });
}

test('the rehearsal after load changes nothing the page shows, and the next edit patches as usual', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 360, height: 740 });
  await page.fill('input[name="frame.reach_mm"]', '481');
  const url = await linkOf(page);
  // The whole markup, view box and ground line included: the rehearsal keeps no drawing.
  const whole = () => page.locator('#drawing svg').evaluate((e) => e.outerHTML.replace(/ data-fit="[^"]*"/, ''));
  const before = { svg: await whole(), url };
  await page.waitForFunction(() => document.documentElement.dataset.rehearsed === 'true', null, { timeout: 30000 });
  assert.deepEqual({ svg: await whole(), url: await page.locator('#share-url').inputValue() }, before);
  // The next edit gets only the changes since the answer the page shows: the same nodes.
  await page.evaluate(() => { window.kept = document.querySelector('#drawing svg'); });
  await page.fill('input[name="setup.stem_mm"]', '60');
  await page.waitForFunction((old) => document.getElementById('share-url').value !== old, before.url, { timeout: 5000 });
  assert.equal(await page.evaluate(() => document.querySelector('#drawing svg') === window.kept), true);
  const fresh = await openPage(env, { width: 360, height: 740, hash: new URL(await page.locator('#share-url').inputValue()).hash });
  await showEveryLayer(page);
  assert.equal(await markup(fresh.page), await markup(page));
  await keepsTheFit(page, fresh.page);
  assert.deepEqual([...problems, ...fresh.problems], []);
  await fresh.context.close();
  await context.close();
});

test('a part that goes or comes replaces the drawing; a zoom survives a patch', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 360, height: 740 });
  assert.equal(await page.locator('#drawing svg .rider').count(), 2);
  await page.evaluate(() => { window.first = document.querySelector('#drawing svg'); });
  // No stem: no cockpit, so no hands on a bar and no rider drawn.
  await page.fill('input[name="setup.stem_mm"]', '');
  await page.waitForFunction(() => document.querySelectorAll('#drawing svg .ridden .stem').length === 0, null, { timeout: 5000 });
  assert.equal(await page.locator('#drawing svg .rider').count(), 0);
  assert.equal(await page.evaluate(() => document.querySelector('#drawing svg') === window.first), false, 'replaced');
  await page.fill('input[name="setup.stem_mm"]', '45');
  await page.waitForFunction(() => document.querySelectorAll('#drawing svg .rider').length === 2, null, { timeout: 5000 });
  // Zoom, then an edit that moves the bike's fit: the view stays; Fit shows the new fit.
  const svg = page.locator('#drawing svg');
  await svg.scrollIntoViewIfNeeded();
  const { fit, zoomed } = await zoomIn(page);
  assert.notEqual(zoomed, fit);
  await page.evaluate(() => { window.kept = document.querySelector('#drawing svg'); });
  const fork = await d(page, 'ridden-fork-leg');
  await page.fill('input[name="frame.reach_mm"]', '520');
  await page.waitForFunction((old) => document.querySelector('#drawing [data-k="ridden-fork-leg"]').getAttribute('points') !== old, fork, { timeout: 5000 });
  assert.equal(await page.evaluate(() => document.querySelector('#drawing svg') === window.kept), true, 'patched');
  assert.equal(await svg.getAttribute('viewBox'), zoomed);
  await page.locator('#fit-view').click();
  assert.notEqual(await svg.getAttribute('viewBox'), fit, 'the new fit, not the one before the edit');
  const url = await linkOf(page);
  const fresh = await openPage(env, { width: 360, height: 740, hash: new URL(url).hash });
  assert.equal(await svg.getAttribute('viewBox'), await fresh.page.locator('#drawing svg').getAttribute('viewBox'));
  assert.deepEqual([...problems, ...fresh.problems], []);
  await fresh.context.close();
  await context.close();
});

for (const [name, width, height] of SIZES) {
  test(`${name}: close-up screenshots of the drawing`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    const shot = (what) => page.locator('#drawing').screenshot({ path: `${SHOTS}/drawing-${name}-${what}.png` });
    await shot('seated');
    await page.locator('label[for="posture-standing"]').click();
    await shot('standing');
    await page.locator('label[for="posture-seated"]').click();
    await page.locator('label.toggle:has(#show-dims)').click();
    await shot('dims');
    await page.locator('label.toggle:has(#show-dims)').click();
    const fork = await d(page, 'ridden-fork-leg');
    await page.fill('input[name="changes.fork_a2c_delta_mm"]', '40');
    await page.waitForFunction((old) => document.querySelector('#drawing [data-k="ridden-fork-leg"]').getAttribute('points') !== old, fork, { timeout: 5000 });
    await shot('fork-ghost');
    assert.deepEqual(problems, []);
    await context.close();
  });
}

// Each circle is a <circle> drawn as a marker of a two-point polyline at its centre (crates/draw
// model::Ring): the pixels show it where it passes. Checked by sampling the screen at points
// worked out from the anchors' centres and the circles' radii, in the drawing's own axes.
test('rings draw their circles: tyre and rim colours where they pass, the background inside', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  await page.evaluate(() => document.getElementById('drawing').classList.add('hide-ghost'));
  const spots = await page.evaluate(() => {
    const at = (key) => document.querySelector(`#drawing [data-k="${key}"]`);
    const centre = (key) => at(key).getAttribute('points').split(' ')[0].split(',').map(Number);
    const r = (key) => Number(at(`${key}.r`).getAttribute('r'));
    const toScreen = (key, dx, dy) => {
      const [x, y] = centre(key);
      const p = new DOMPoint(x + dx, y + dy).matrixTransform(at(key).getScreenCTM());
      return [Math.round(p.x), Math.round(p.y)];
    };
    const css = getComputedStyle(document.documentElement);
    return {
      colours: {
        tyre: css.getPropertyValue('--tyre').trim(),
        rim: css.getPropertyValue('--rim').trim(),
        // The first background behind the drawing that is not transparent.
        paper: (() => {
          for (let e = document.querySelector('#drawing svg'); e; e = e.parentElement) {
            const c = getComputedStyle(e).backgroundColor;
            if (!/^rgba\(.*, 0\)$|^transparent$/.test(c)) return c;
          }
          return 'rgb(255, 255, 255)';
        })(),
      },
      // The rear tyre's and rear rim's rearmost points, a point behind the rear axle inside the
      // rim, the front rim's foremost point (its key has a dot: ridden-rim.1). (The hubs lie
      // under the stays and the fork.)
      rearRim: toScreen('ridden-rim', -r('ridden-rim'), 0),
      tyre: toScreen('ridden-tyre-rear', -r('ridden-tyre-rear'), 0),
      inside: toScreen('ridden-tyre-rear', -0.55 * r('ridden-tyre-rear'), 0),
      rim: toScreen('ridden-rim.1', r('ridden-rim.1'), 0),
    };
  });
  await page.evaluate(() => document.querySelector('#drawing svg').getBBox());
  const blank = await context.newPage();
  const pixel = async ([x, y]) => {
    const png = await page.screenshot({ clip: { x, y, width: 1, height: 1 } });
    return blank.evaluate(async (b64) => {
      const img = new Image();
      img.src = `data:image/png;base64,${b64}`;
      await img.decode();
      const c = new OffscreenCanvas(1, 1).getContext('2d');
      c.drawImage(img, 0, 0);
      return [...c.getImageData(0, 0, 1, 1).data.slice(0, 3)];
    }, png.toString('base64'));
  };
  const rgb = (c) => (c.startsWith('#')
    ? [1, 3, 5].map((i) => parseInt(c.slice(i, i + 2), 16))
    : c.match(/\d+/g).slice(0, 3).map(Number));
  const near = (got, want, what) => assert.ok(
    got.every((v, i) => Math.abs(v - want[i]) <= 40), `${what}: pixel ${got}, expected about ${want}`);
  const { colours } = spots;
  near(await pixel(spots.rearRim), rgb(colours.rim), 'rear rim, rearmost point');
  near(await pixel(spots.tyre), rgb(colours.tyre), 'rear tyre, rearmost point');
  near(await pixel(spots.rim), rgb(colours.rim), 'front rim, foremost point');
  near(await pixel(spots.inside), rgb(colours.paper), 'inside the rear wheel');
  assert.deepEqual(problems, []);
  await context.close();
});

// The page sends an edit of one field to the form the wasm module holds (crates/web edit.rs);
// filling the form from a chart size (a whole form) starts a new one. After both, in any order,
// the page shows what a fresh page of the same link shows.
test('one-field edits after a chart size and a choice give the drawing and tables of a fresh page', T, async () => {
  const { page, context, problems } = await openPage(env, { width: 1280, height: 800 });
  await page.fill('input[name="setup.stem_mm"]', '55'); // held: the demo form with this stem
  await page.fill('#chart-text', readFileSync(`${ROOT}tests/charts/01_web_tab_columns.txt`, 'utf8'));
  await page.click('#chart-read');
  await page.waitForSelector('#chart-out button.size[data-size="L"]', { timeout: 10000 });
  await page.click('#chart-out button.size[data-size="L"]');
  await page.fill('input[name="frame.head_tube_mm"]', '115'); // a field the chart left blank
  const barType = page.locator('select[name="setup.bar_type"]');
  await barType.evaluate((e) => { e.closest('details').open = true; }); // under "More cockpit"
  await barType.selectOption('drop');
  const linkBefore = await page.evaluate(() => location.hash);
  await page.fill('input[name="frame.reach_mm"]', '47,8 cm');
  await settled(page);
  // The address follows the edit once typing pauses.
  await page.waitForFunction((old) => location.hash !== old && document.getElementById('share-url').value === location.href, linkBefore, { timeout: 5000 });
  const url = await page.locator('#share-url').inputValue();
  const fresh = await openPage(env, { width: 1280, height: 800, hash: new URL(url).hash });
  await settled(fresh.page);
  const shown = async (p) => ({
    form: await p.evaluate(() => Object.fromEntries([...document.getElementById('bike-form').elements].filter((e) => e.name).map((e) => [e.name, e.value]))),
    tables: await p.evaluate(() => { document.documentElement.dataset.renderAll = ''; return document.getElementById('results').textContent; }),
  });
  const [mine, theirs] = [await shown(page), await shown(fresh.page)];
  assert.equal(mine.form['frame.reach_mm'], '47,8 cm');
  assert.equal(mine.form['setup.stem_mm'], '55', 'the chart size leaves the cockpit alone');
  assert.equal(mine.form['setup.bar_type'], 'drop');
  assert.match(mine.tables, /478\.0/, 'the tables show the typed reach');
  assert.match(mine.tables, /Bar pullbackmm−125\.0/, 'a drop bar reaches forward of the clamp');
  assert.equal(theirs.tables, mine.tables);
  await showEveryLayer(page);
  assert.equal(await markup(fresh.page), await markup(page));
  assert.deepEqual([...problems, ...fresh.problems], []);
  await fresh.context.close();
  await context.close();
});
