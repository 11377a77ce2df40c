// Narrow phones (320 px) and 360 px windows that show a scrollbar (345 px of page): the drawing's
// toolbar and the jump links stay on one row, nothing scrolls sideways, targets stay ≥ 44 px.
import { test, before, after } from 'node:test';
import assert from 'node:assert/strict';
import { startAll, openPage, SHOTS } from './harness.mjs';

let env;
before(async () => { env = await startAll(); });
after(async () => { await env?.stop(); });

for (const width of [320, 345, 360]) {
  test(`${width} px: toolbar and jump links on one row`, { timeout: 60000 }, async () => {
    const { page, problems } = await openPage(env, { width, height: 740 });
    const m = await page.evaluate(() => {
      const tops = (sel) => [...document.querySelectorAll(sel)].map((e) => Math.round(e.getBoundingClientRect().top));
      const sizes = [...document.querySelectorAll('.toolbar label, .toolbar .toggle, #fit-view')]
        .map((e) => { const r = e.getBoundingClientRect(); return Math.min(r.width, r.height); });
      return {
        toolbar: new Set(tops('.toolbar label, .toolbar .toggle')).size,
        jump: new Set(tops('.jump a')).size,
        jumpHeights: [...document.querySelectorAll('.jump a')].map((e) => e.getBoundingClientRect().height),
        sideways: document.documentElement.scrollWidth - window.innerWidth,
        smallest: Math.min(...sizes),
      };
    });
    assert.equal(m.toolbar, 1, 'toolbar controls share one row');
    assert.equal(m.jump, 1, 'jump links share one row');
    assert.ok(m.jumpHeights.every((h) => h < 50), `jump links are one line high: ${m.jumpHeights}`);
    assert.equal(m.sideways, 0, 'nothing scrolls sideways');
    assert.ok(m.smallest >= 44, `touch targets at least 44 px, smallest ${m.smallest}`);
    await page.screenshot({ path: `${SHOTS}/narrow-${width}.png`, clip: { x: 0, y: 0, width, height: 420 } });
    assert.deepEqual(problems, []);
  });
}

// The tables' names on a phone: a table of one or two value columns gives its names more of the
// row (one value: 75 %, two: 54 %; style.css), so that no name there runs to three lines (they did at 38 %: "Sit point from BB,
// horizontal mm"); the frame's table (three value columns) keeps its numbers whole.
for (const width of [320, 360]) {
  test(`${width} px: names in the one- and two-value tables take at most two lines; no ° or % on a line of its own`, { timeout: 60000 }, async () => {
    const { page, problems } = await openPage(env, { width, height: 740 });
    await page.evaluate(() => document.documentElement.setAttribute('data-render-all', ''));
    const m = await page.evaluate(() => {
      const lines = (th) => {
        const b = th.querySelector('button.term');
        return Math.round(b.getBoundingClientRect().height / parseFloat(getComputedStyle(b).lineHeight));
      };
      const of = (sel) => [...document.querySelectorAll(sel)].map((th) => [th.closest('tr').dataset.key, lines(th)]);
      const cut = [...document.querySelectorAll('.numbers td.num .v')].filter((v) => v.scrollWidth > v.clientWidth + 1)
        .map((v) => v.textContent);
      // A sign (° or %) on a line of its own: its middle not on the line of the name's last letter.
      const alone = [...document.querySelectorAll('.numbers button.term')].filter((btn) => {
        const u = btn.querySelector('.u');
        if (!u || u.textContent.length > 1) return false;
        const walk = document.createTreeWalker(btn, NodeFilter.SHOW_TEXT);
        let last = null;
        for (let n = walk.nextNode(); n; n = walk.nextNode()) if (!u.contains(n) && n.data.trim()) last = n;
        const r = document.createRange();
        const end = last.data.trimEnd().length;
        r.setStart(last, end - 1); r.setEnd(last, end);
        const a = r.getBoundingClientRect(), b = u.getBoundingClientRect();
        return Math.abs((a.top + a.bottom) / 2 - (b.top + b.bottom) / 2) > a.height / 2;
      }).map((btn) => btn.textContent);
      // A name's lines: the height of its text (the unit's smaller type included) in lines.
      const textLines = (th) => {
        const b = th.querySelector('button.term');
        const r = document.createRange();
        r.selectNodeContents(b);
        return Math.round(r.getBoundingClientRect().height / parseFloat(getComputedStyle(b).lineHeight));
      };
      const single = [...document.querySelectorAll('.numbers.one-value th[scope="row"]')]
        .map((th) => [th.textContent, textLines(th)]);
      return { narrow: of('.numbers.one-value th[scope="row"], .numbers.two-values th[scope="row"]'), cut, alone, single };
    });
    assert.ok(m.narrow.length >= 30, `names in the one- and two-value tables: ${m.narrow.length}`);
    const long = m.narrow.filter(([, n]) => n > 2);
    assert.deepEqual(long, [], 'no name of three lines or more');
    assert.deepEqual(m.cut, [], 'every number shown whole');
    assert.deepEqual(m.alone, [], 'no ° or % on a line of its own');
    // At 360 px a one-value table's name of up to 28 letters with its unit ("Bar clamp, ahead of
    // BB mm", "Longest dropper that fits mm") takes one line: the name has three quarters of the
    // row (at 62 %, 11 of the 28 names took two lines, these among them; now 4, all longer).
    if (width === 360) {
      assert.ok(m.single.length >= 20, `names in the one-value tables: ${m.single.length}`);
      const wrapped = m.single.filter(([text, n]) => text.length <= 28 && n > 1);
      assert.deepEqual(wrapped, [], 'short names on one line');
    }
    assert.deepEqual(problems, []);
  });
}

// A phone held sideways: the whole drawing is in sight on first view, beside the masthead and the
// toolbar (each a column on its left, so the drawing's box is as tall as the screen and its labels
// as large as on a phone held upright: labels.test.mjs), and the targets stay ≥ 44 px.
for (const [width, height] of [[640, 360], [740, 360], [915, 412]]) {
  test(`${width}×${height} (a phone held sideways): the drawing fits the screen on first view`, { timeout: 60000 }, async () => {
    const { page, problems } = await openPage(env, { width, height });
    const m = await page.evaluate(() => {
      const r = (sel) => document.querySelector(sel).getBoundingClientRect();
      const sizes = [...document.querySelectorAll('.toolbar label, .toolbar .toggle, #fit-view, .jump a')]
        .map((e) => { const b = e.getBoundingClientRect(); return Math.min(b.width, b.height); });
      return {
        box: r('#drawing').toJSON(), bike: r('#drawing svg .ridden').toJSON(),
        masthead: [...document.querySelectorAll('.masthead h1, .jump a')].map((e) => e.getBoundingClientRect().toJSON()),
        toolbar: [...document.querySelectorAll('.toolbar label, .toolbar .toggle')].map((e) => e.getBoundingClientRect().toJSON()),
        sideways: document.documentElement.scrollWidth - window.innerWidth, smallest: Math.min(...sizes),
      };
    });
    assert.ok(m.box.top >= 0 && m.box.bottom <= height, `drawing box ${JSON.stringify(m.box)} within ${height} px`);
    assert.ok(m.bike.top >= m.box.top && m.bike.bottom <= m.box.bottom, `bike ${JSON.stringify(m.bike)} inside its box`);
    assert.ok(m.box.height >= 0.6 * height, `the drawing takes most of the height: ${m.box.height}`);
    assert.ok(m.box.height >= height - 20, `the drawing's box is about as tall as the screen: ${m.box.height}`);
    // The masthead's name and jump links one above another, left of the toolbar; the toolbar's
    // controls left of the drawing; all on the screen.
    const right = (rs) => Math.max(...rs.map((b) => b.right));
    assert.ok(m.masthead.every((b, i) => i === 0 || b.top >= m.masthead[i - 1].bottom), `masthead in a column: ${JSON.stringify(m.masthead)}`);
    assert.ok(right(m.masthead) <= Math.min(...m.toolbar.map((b) => b.left)), 'the masthead left of the toolbar');
    assert.ok(right(m.toolbar) <= m.box.left, 'the toolbar left of the drawing');
    assert.ok([...m.masthead, ...m.toolbar].every((b) => b.top >= 0 && b.bottom <= height), 'masthead and toolbar on the screen');
    assert.equal(m.sideways, 0, 'nothing scrolls sideways');
    assert.ok(m.smallest >= 44, `touch targets at least 44 px, smallest ${m.smallest}`);
    await page.screenshot({ path: `${SHOTS}/landscape-${width}x${height}.png` });
    assert.deepEqual(problems, []);
  });
}

// A short desk window (wider than a phone held sideways) keeps the desk's layout: the masthead
// above, the toolbar's words, the inputs beside the drawing.
test('1280×500 (a short desk window): the desk layout, not the sideways phone\'s', { timeout: 60000 }, async () => {
  const { page, problems } = await openPage(env, { width: 1280, height: 500 });
  const m = await page.evaluate(() => ({
    body: getComputedStyle(document.body).display,
    words: [...document.querySelectorAll('.toolbar .tl')].map((e) => e.getBoundingClientRect().width),
    inputs: document.querySelector('.input-col').getBoundingClientRect().left,
    drawing: document.querySelector('#drawing').getBoundingClientRect().right,
  }));
  assert.notEqual(m.body, 'grid', 'the masthead is not a column beside the page');
  assert.ok(m.words.length && m.words.every((w) => w > 1), `the toolbar keeps its words: ${m.words}`);
  assert.ok(m.inputs >= m.drawing, 'the inputs beside the drawing');
  assert.deepEqual(problems, []);
});
