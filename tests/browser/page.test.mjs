// Browser tests of the page's main flows at a phone (360×740) and a desk (1280×800) size: the
// demo bike loads and draws, typed numbers give the right results (checked against the published
// formulas, not against our own output), edits redraw at once, bad values are explained beside
// their field while the last good drawing stays, and the page logs no error.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { startAll, openPage, SHOTS, shot, frames } from './harness.mjs';
import { cell, waitCell } from './page-helpers.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

const T = { timeout: 60000 };
const SIZES = [['phone', 360, 740], ['desk', 1280, 800]];
const rad = (d) => (d * Math.PI) / 180;

for (const [name, width, height] of SIZES) {
  test(`${name}: the demo bike draws with its frame, fork, wheels and tables`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    assert.equal(await page.locator('#drawing svg .ridden .tyre').count(), 2);
    assert.equal(await page.locator('#drawing svg .ground').count(), 1);
    assert.equal(await page.locator('#drawing svg .ridden .fork-leg').count(), 1);
    assert.equal(await page.locator('#drawing svg .ghost .tyre').count(), 2);
    assert.ok(await page.locator('#results tr[data-key]').count() >= 20);
    // The handling table has a column per case with numbers: seated and standing (no point load
    // was given, so no column of dashes for one).
    const handlingCols = await page.$$eval('#results table', (tables) => {
      const t = tables.find((x) => x.caption?.textContent.trim() === 'Handling');
      return t ? [...t.querySelectorAll('thead th')].map((th) => th.textContent.trim()) : null;
    });
    assert.deepEqual(handlingCols, ['Measure', 'Seated', 'Standing']);
    // Every input is labelled and shows its unit.
    const unlabelled = await page.$$eval('#bike-form input, #bike-form select',
      (els) => els.filter((e) => !e.labels?.length).map((e) => e.name));
    assert.deepEqual(unlabelled, []);
    const box = await page.locator('#drawing svg').boundingBox();
    // The whole drawing is on screen at first view.
    assert.ok(box.x >= 0 && box.x + box.width <= width && box.y + box.height <= height,
      `drawing ${JSON.stringify(box)} fits ${width}×${height}`);
    const scroll = await page.evaluate(() => document.documentElement.scrollWidth);
    assert.ok(scroll <= width, `no sideways scrolling: ${scroll} > ${width}`);
    // Paste box, share box and inputs stack in one column (beside the drawing on a desk).
    const xs = await page.$$eval('#chart, .share-card, #bike-form', (els) => els.map((e) => Math.round(e.getBoundingClientRect().x)));
    assert.equal(new Set(xs).size, 1, `one input column: ${xs}`);
    await shot(page, `${SHOTS}/page-${name}.png`);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: trail and wheelbase equal the published formulas`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    // Source: ground trail T = (R·cos h − o) / sin h, R the outer tyre radius, h the head angle,
    // o the fork offset (Wikipedia, "Bicycle and motorcycle geometry"). Demo: 29x2.4 tyre →
    // R = 622/2 + 2.4·25.4 mm (ISO 5775 section-height estimate), h = 65°, o = 44 mm.
    const R = 622 / 2 + 2.4 * 25.4;
    const h = rad(65);
    await waitCell(page, 'trail_mm', (R * Math.cos(h) - 44) / Math.sin(h), 0.06);
    await page.fill('input[name="frame.fork_offset_mm"]', '51');
    await waitCell(page, 'trail_mm', (R * Math.cos(h) - 51) / Math.sin(h), 0.06);
    // Source: DESIGN.md §8a frame points. Typed in inches and with a decimal comma.
    await page.fill('input[name="frame.fork_offset_mm"]', '1,75 in');
    await waitCell(page, 'trail_mm', (R * Math.cos(h) - 44.45) / Math.sin(h), 0.06);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: editing a field changes the drawing and the table together`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    const before = await page.locator('#drawing svg').innerHTML();
    const wb = await cell(page, 'wheelbase_mm');
    await page.fill('input[name="frame.reach_mm"]', '500');
    await page.waitForFunction((old) => document.querySelector('#drawing svg').innerHTML !== old, before, { timeout: 5000 });
    // Source: §8a — reach moves the head tube, fork and front axle forward by the same amount.
    await waitCell(page, 'wheelbase_mm', wb + 30, 0.15);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: a bad value shows its message beside the field and the last drawing stays`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    const good = await page.locator('#drawing svg').innerHTML();
    const table = await page.locator('#results').innerHTML();
    const cases = [
      ['frame.head_angle_deg', 'steep', /^Head tube angle "steep" is not a number; enter an angle in degrees such as 65°\.$/],
      ['frame.head_angle_deg', '', /^Head tube angle is required: enter an angle/],
      ['frame.head_angle_deg', '95', /Head tube angle must be between 45 and 85°, got 95/],
      // Inside its own range, but with the other numbers no frame: said beside the head angle the
      // person typed, not on the blank BB drop (crates/kernel/src/solve/blame.rs).
      ['frame.head_angle_deg', '45', /^The published head tube angle 45\.0°, stack 635 mm and head tube length 110 mm together put the BB drop at 183 mm, which no frame can have \(allowed \u2212150 to 150 mm\); check the head tube angle first/],
      ['wheels.front', '31x9', /not recognised/],
      ['rider.height_mm', 'tall', /^Height "tall" is not a number; enter a length such as 1780 mm, 178 cm or 5'10"\.$/],
    ];
    for (const [field, value, pattern] of cases) {
      await page.fill(`[name="${field}"]`, value);
      const input = page.locator(`[name="${field}"]`);
      // While the person types, the half-typed value is not called wrong at once; leaving the
      // field says it (a pause in typing does too, below).
      assert.equal(await input.getAttribute('aria-invalid'), null, `${field}: not marked while typing`);
      await input.blur();
      const ids = (await input.getAttribute('aria-describedby')).split(' ');
      const msg = page.locator(`#${ids[0]}`);
      assert.match(await msg.textContent(), pattern);
      assert.ok(await msg.isVisible(), `${field} message visible`);
      assert.equal(await input.getAttribute('aria-invalid'), 'true');
      assert.equal(await page.locator('#drawing svg').innerHTML(), good, 'the last good drawing stays');
      assert.equal(await page.locator('#results').innerHTML(), table, 'the last good numbers stay');
      assert.doesNotMatch(await page.locator('body').textContent(), /NaN|Infinity/);
      // The line under the drawing names the field, a link to its box (far below on a phone).
      const label = await page.locator(`label[for="${await input.getAttribute('id')}"]`).textContent();
      assert.equal(await page.locator('#status').textContent(), `Fix ${label}; the drawing and numbers show the last good values.`);
      assert.equal(await page.locator('#status a').getAttribute('href'), `#${await input.getAttribute('id')}`);
      await page.fill(`[name="${field}"]`, field === 'wheels.front' ? '29x2.4' : field === 'rider.height_mm' ? '1780' : '65');
    }
    await page.fill('input[name="frame.head_angle_deg"]', '95');
    // Still in the field: the message comes after a pause in typing.
    await page.waitForSelector('input[name="frame.head_angle_deg"][aria-invalid="true"]', { timeout: 5000 });
    assert.match(await page.locator('#f-frame-head-angle-deg-msg').textContent(), /must be between 45 and 85°/);
    await shot(page, `${SHOTS}/page-${name}-bad-value.png`);
    await page.fill('input[name="frame.head_angle_deg"]', '65');
    await page.waitForFunction(() => !document.querySelector('[aria-invalid="true"]'), null, { timeout: 5000 });
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: a length typed without its unit on a number pad is read in cm or inches and said`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    // 47,5 mm is no reach (the kernel allows 100–800 mm); 47,5 cm = 475 mm is one.
    // Source: 1 cm = 10 mm (SI).
    await page.fill('input[name="frame.reach_mm"]', '47,5');
    await waitCell(page, 'reach_mm', 475, 0.06);
    const input = page.locator('input[name="frame.reach_mm"]');
    const msg = page.locator('#f-frame-reach-mm-msg');
    assert.match(await msg.textContent(), /^Read as 47,5 cm = 475 mm: no unit was typed/);
    assert.ok(await msg.isVisible());
    assert.equal(await msg.getAttribute('class'), 'msg note');
    assert.equal(await input.getAttribute('aria-invalid'), null, 'a note, not an error');
    assert.match(await input.getAttribute('aria-describedby'), /f-frame-reach-mm-msg/);
    await shot(page, `${SHOTS}/page-${name}-unit-read.png`, {}, page.locator('.field:has(input[name="frame.reach_mm"])'));
    // Typed with its own unit: the length in mm is said beside the box, whose unit reads mm.
    // Source: 1 in = 25.4 mm exactly (international yard and pound agreement, 1959): 18.7 in =
    // 474.98 mm, said to the tenth.
    await page.fill('input[name="frame.reach_mm"]', '18.7in');
    await waitCell(page, 'reach_mm', 474.98, 0.06);
    assert.equal(await msg.textContent(), 'Read as 475 mm.');
    await page.fill('input[name="frame.reach_mm"]', '47.25 cm');
    await waitCell(page, 'reach_mm', 472.5, 0.06);
    assert.equal(await msg.textContent(), 'Read as 472.5 mm.');
    assert.equal(await msg.getAttribute('class'), 'msg note');
    // Typed in mm again (with or without its mark): the note goes.
    await page.fill('input[name="frame.reach_mm"]', '471 mm');
    await waitCell(page, 'reach_mm', 471, 0.06);
    assert.equal(await msg.textContent(), '');
    await page.fill('input[name="frame.reach_mm"]', '470');
    await waitCell(page, 'reach_mm', 470, 0.06);
    assert.equal(await msg.textContent(), '');
    assert.equal(await msg.getAttribute('class'), 'msg');
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: a new listing starts blank, and values under "more" are counted`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    const more = page.locator('.group-frame details.more summary');
    // The demo has an actual seat angle and a lower headset stack under "More frame numbers".
    assert.equal(await more.textContent(), 'More frame numbers from the listing (9, 2 filled)');
    const good = await page.locator('#drawing svg').innerHTML();
    await page.click('button.clear-frame');
    const left = await page.$$eval('#bike-form [name^="frame."], #bike-form [name="label"]',
      (els) => els.filter((e) => e.value !== '').map((e) => e.name));
    assert.deepEqual(left, []);
    assert.equal(await more.textContent(), 'More frame numbers from the listing (9)');
    assert.equal(await page.evaluate(() => document.activeElement?.name), 'frame.reach_mm');
    // The blank listing's numbers are asked for under the drawing (each a link to its box), not
    // marked as errors before the person has typed anything.
    assert.equal(await page.locator('#bike-form [aria-invalid="true"]').count(), 0);
    assert.equal(await page.locator('#status').textContent(),
      "Type the listing's numbers, at least Head tube angle, Reach, Stack; until then the drawing and numbers show the last good bike.");
    assert.equal(await page.locator('#status a').first().getAttribute('href'), '#f-frame-head-angle-deg');
    assert.equal(await page.locator('#drawing svg').innerHTML(), good, 'the last good drawing stays');
    // A listing's own numbers: the page solves them alone, with nothing to disagree with. Typing
    // reach and leaving it marks no blank field.
    await page.fill('input[name="frame.reach_mm"]', '480');
    await page.keyboard.press('Tab');
    await page.waitForTimeout(900); // past the typing pause (web/app.js)
    assert.equal(await page.locator('#bike-form [aria-invalid="true"]').count(), 0);
    await page.fill('input[name="frame.stack_mm"]', '630');
    await page.fill('input[name="frame.head_angle_deg"]', '64');
    await waitCell(page, 'reach_mm', 480, 0.06);
    await page.locator('.group-frame details.more').evaluate((d) => { d.open = true; });
    await page.fill('input[name="frame.rear_centre_mm"]', '440');
    await page.waitForFunction(() => document.querySelector('.group-frame details.more summary').textContent === 'More frame numbers from the listing (9, 1 filled)', null, { timeout: 5000 });
    assert.equal(await page.locator('#results tr.inconsistent').count(), 0);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: a published standover shows as published, not as solved (it is not derivable)`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    await page.locator('.group-frame details.more').evaluate((d) => { d.open = true; });
    await page.fill('input[name="frame.standover_mm"]', '780');
    await waitCell(page, 'standover_mm', 780, 0.05, 'given');
    assert.equal(await page.locator('#results tr[data-key="standover_mm"] td[data-col="stock"]').textContent(), '–');
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: while typing, a phone shows the key numbers at the top of the screen`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    const strip = page.locator('#strip');
    assert.equal(await strip.isVisible(), false, 'hidden until the form has the focus');
    const grip = () => strip.locator('div[title="BB-to-grip distance"] dd').textContent();
    await page.fill('input[name="frame.reach_mm"]', '490');
    await waitCell(page, 'reach_mm', 490, 0.06);
    if (width < 960) {
      assert.ok(await strip.isVisible());
      const box = await strip.boundingBox();
      assert.equal(box.y, 0, 'at the top of the screen');
      assert.ok(box.height <= 96, `a short strip: ${box.height} px`);
      // The same numbers as the tables, whole mm.
      assert.equal(await strip.locator('div[title="Reach"] dd').textContent(), '490 mm');
      // Narrow cells take the glossary's short names (Rust); the full name is the title.
      assert.equal(await strip.locator('div[title="BB-to-grip distance"] dt').textContent(), 'BB to grip');
      assert.equal(await strip.locator('div[title="Head tube angle"] dt').textContent(), 'Head angle');
      // A tap on a number says what it is (the catalogue's words), and the focus stays in the form.
      await strip.locator('div[title="Head tube angle"]').click();
      assert.match(await strip.locator('.strip-def').textContent(), /^Head tube angle \S.+\.$/);
      assert.equal(await page.evaluate(() => document.activeElement.name), 'frame.reach_mm');
      assert.ok(await strip.isVisible(), 'the strip stays');
      const wheelbase = Math.round(await cell(page, 'wheelbase_mm'));
      assert.equal(await strip.locator('div[title="Wheelbase"] dd').textContent(), `${wheelbase} mm`);
      // A longer stem moves the grip away from the BB.
      const before = Number.parseFloat(await grip());
      await page.fill('input[name="setup.stem_mm"]', '70');
      await page.waitForFunction((b) => Number.parseFloat(document.querySelector('#strip div[title="BB-to-grip distance"] dd').textContent) > b, before, { timeout: 5000 });
      // The strip counts what the page marks: cautions, disagreeing numbers and fit checks
      // outside their range (the demo's knee bend), and links to them.
      const cautions = strip.locator('a.strip-cautions');
      const marked = () => page.evaluate(() => document.querySelectorAll('#warnings li.caution, #warnings li.inconsistent, #checks li.outside').length);
      const counted = await marked();
      assert.equal(await cautions.textContent(), counted ? `${counted} warning${counted > 1 ? 's' : ''}` : 'No warnings');
      // A fork 20 mm longer is a caution: one more, and the link goes to the warnings list.
      await page.fill('input[name="changes.fork_a2c_delta_mm"]', '20');
      await page.waitForFunction((n) => document.querySelector('#strip a.strip-cautions').textContent === `${n + 1} warnings`, counted, { timeout: 5000 });
      assert.equal(await marked(), counted + 1);
      assert.equal(await cautions.getAttribute('href'), '#warnings');
      assert.match(await page.locator('#warnings').textContent(), /20 mm longer than stock/);
      // Scrolled up to the drawing with the focus still in the form, the strip leaves the page.
      await page.evaluate(() => scrollTo(0, 0));
      await page.waitForFunction(() => getComputedStyle(document.getElementById('strip')).display === 'none', null, { timeout: 5000 });
      await page.locator('input[name="changes.fork_a2c_delta_mm"]').scrollIntoViewIfNeeded();
      await page.waitForFunction(() => getComputedStyle(document.getElementById('strip')).display !== 'none', null, { timeout: 5000 });
      await page.fill('input[name="changes.fork_a2c_delta_mm"]', '');
      await page.locator('input[name="setup.stem_mm"]').focus();
      // The focused field stays clear of the strip.
      const field = await page.locator('input[name="setup.stem_mm"]').boundingBox();
      assert.ok(field.y >= box.y + box.height, `the field (${field.y}) is below the strip`);
      await shot(page, `${SHOTS}/page-${name}-strip.png`);
      await page.locator('input[name="setup.stem_mm"]').blur();
      assert.equal(await strip.isVisible(), false, 'gone with the focus');
    } else {
      assert.equal(await strip.isVisible(), false, 'a desk shows the drawing and tables beside the form');
    }
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: a published value that disagrees is marked and explained in a sentence`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    // The demo frame's wheelbase is fixed by reach, head angle, fork and chainstay (§8a: about
    // 1232 mm); a published 1272 mm cannot also hold.
    await page.fill('input[name="frame.wheelbase_mm"]', '1272');
    const row = page.locator('#results tr[data-key="wheelbase_mm"]').first();
    await page.waitForFunction(() => document.querySelector('#results tr[data-key="wheelbase_mm"]')?.classList.contains('inconsistent'), null, { timeout: 5000 });
    assert.equal(await row.locator('td[data-col="given"]').textContent(), '1272.0');
    assert.equal(await row.locator('.term').evaluate((b) => getComputedStyle(b, '::before').content), '"⚠ "', 'the mark is by the name');
    const note = page.locator('#results tr[data-key="wheelbase_mm"] + tr.note-row').first();
    const said = await note.textContent();
    assert.match(said, /^Wheelbase is published as 1272 mm but the other published numbers make it \d+ mm, \d+ mm away/);
    // The figure quoted is what the other numbers give without it (about 1232 mm), not the fit.
    const others = Number(said.match(/make it (\d+) mm/)[1]);
    assert.ok(Math.abs(others - 1232) <= 3, said);
    assert.ok(await note.isVisible());
    // One loop any one of several values would close is said once, not value by value.
    const warned = await page.locator('#results .warnings').textContent();
    assert.match(warned, /disagree: .*wheelbase.* do not fit one frame together/);
    assert.match(warned, /wheelbase by \d+ mm \(1272 mm published, \d+ mm from the others\)/);
    // Parts above the note are drawn at their real height once near the screen (style.css,
    // content-visibility), which moves the note: scroll to it again once they are.
    await note.scrollIntoViewIfNeeded();
    await frames(page);
    await note.scrollIntoViewIfNeeded();
    await shot(page, `${SHOTS}/page-${name}-inconsistent.png`);
    assert.deepEqual(problems, []);
    await context.close();
  });

  test(`${name}: every number sits whole in a box laid out alone`, T, async () => {
    const { page, context, problems } = await openPage(env, { width, height });
    await page.fill('input[name="frame.wheelbase_mm"]', '1272'); // a marked published value
    await page.waitForFunction(() => document.querySelector('#results tr[data-key="wheelbase_mm"]')?.classList.contains('inconsistent'), null, { timeout: 5000 });
    await page.evaluate(() => { document.documentElement.dataset.renderAll = ''; });
    await frames(page);
    const boxes = await page.$$eval('#results td.num', (tds) => tds.map((td) => {
      const v = td.querySelector(':scope > span.v');
      if (!v) return { text: td.textContent, box: false };
      const s = getComputedStyle(v);
      return {
        text: v.textContent,
        box: true,
        // A relayout boundary in Chromium: size-contained, positioned, not a flex or grid item.
        contained: s.contain === 'strict' && s.position === 'relative' && !/flex|grid/.test(getComputedStyle(td).display),
        clipped: v.scrollWidth > v.clientWidth + 0.5 || v.scrollHeight > v.clientHeight + 0.5,
      };
    }));
    assert.ok(boxes.length >= 60, `${boxes.length} numbers`);
    assert.deepEqual(boxes.filter((b) => !b.box || !b.contained || b.clipped), []);
    assert.ok(boxes.some((b) => b.text === '1272.0'));
    assert.deepEqual(problems, []);
    await context.close();
  });
}
