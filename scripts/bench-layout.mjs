// Where an edit's style-and-layout time goes, part by part: replays the DOM changes of one real
// edit (reach 470 → 478 mm with a fork change and 20 % front sag, so the ridden bike differs from
// the stock one) back and forth, one part at a time, and times the forced style and layout that
// follows (`offsetHeight` and the drawing's `getBBox()`), median over N replays per part:
//   field     the typed text box's new value (the reach box, wherever it is on the page)
//   drawing   every changed attribute and label of the drawing's SVG
//   results   every changed text in the result blocks (all of them, on the screen or not)
// A variant is a style sheet added for the run (`--variant name='css'`, repeatable), to compare
// a layout idea against the page as it is (`base`) under the same machine load; the parts of all
// variants are interleaved. (A `<style>` element would be refused by the page's CSP; variants
// use a constructed style sheet.)
//
// Usage: node scripts/bench-layout.mjs [--width 360|1280] [--rate 1] [--replays 100]
//          [--variant name='css' …]                                   (after scripts/build)
import { startAll, openPage } from '../tests/browser/harness.mjs';

function option(name, fallback) {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? process.argv[i + 1] : fallback;
}
const width = Number(option('width', 360));
const rate = Number(option('rate', 1));
const replays = Number(option('replays', 100));
const variants = { base: '' };
process.argv.forEach((a, i) => {
  if (a !== '--variant') return;
  const [name, ...css] = process.argv[i + 1].split('=');
  variants[name] = css.join('=');
});

/** In the page: the replay, returning { part variant: [write ms, layout ms] medians }. */
async function replay([variants, replays]) {
  const sheet = new CSSStyleSheet();
  document.adoptedStyleSheets = [sheet];
  const set = (n, v) => {
    const input = document.querySelector(`[name="${n}"]`);
    input.value = v;
    input.dispatchEvent(new Event('input', { bubbles: true }));
  };
  const pause = (ms) => new Promise((ok) => setTimeout(ok, ms));
  const svgState = () => [...document.querySelectorAll('#drawing svg *')]
    .map((e) => [e, [...e.attributes].map((a) => [a.name, a.value]), e.tagName === 'text' ? e.textContent : null]);
  const textState = () => {
    const w = document.createTreeWalker(document.getElementById('results'), NodeFilter.SHOW_TEXT);
    const out = [];
    while (w.nextNode()) out.push([w.currentNode, w.currentNode.data]);
    return out;
  };
  set('changes.fork_travel_mm', '150');
  set('changes.front_sag_pct', '20');
  set('frame.reach_mm', '470');
  await pause(300);
  const a = { drawing: svgState(), results: textState() };
  set('frame.reach_mm', '478');
  await pause(300);
  const b = { drawing: svgState(), results: textState() };
  const field = document.querySelector('[name="frame.reach_mm"]');
  const apply = {
    field: (s) => { field.value = s === a ? '470' : '478'; },
    drawing: (s) => {
      for (const [e, attrs, text] of s.drawing) {
        for (const [n, v] of attrs) if (e.getAttribute(n) !== v) e.setAttribute(n, v);
        if (text !== null && e.textContent !== text) e.textContent = text;
      }
    },
    results: (s) => { for (const [n, d] of s.results) if (n.data !== d) n.data = d; },
  };
  const shown = { field: b, drawing: b, results: b }; // what each part shows now
  const runs = Object.keys(variants).flatMap((v) => Object.keys(apply).map((p) => [p, v]));
  const times = new Map(runs.map(([p, v]) => [`${p} ${v}`, []]));
  for (let i = 0; i < replays * runs.length; i += 1) {
    const [p, v] = runs[i % runs.length];
    sheet.replaceSync(variants[v]);
    const next = shown[p] === a ? b : a;
    void document.body.offsetHeight;
    const t0 = performance.now();
    apply[p](next);
    const t1 = performance.now();
    void document.body.offsetHeight;
    void document.querySelector('#drawing svg').getBBox();
    times.get(`${p} ${v}`).push([t1 - t0, performance.now() - t1]);
    shown[p] = next;
    await pause(5);
  }
  const median = (xs) => xs.sort((x, y) => x - y)[xs.length >> 1];
  const changed = {
    drawing: a.drawing.filter((x, j) => JSON.stringify(x.slice(1)) !== JSON.stringify(b.drawing[j]?.slice(1))).length,
    results: a.results.filter((x, j) => x[1] !== b.results[j]?.[1]).length,
  };
  return {
    changed,
    medians: Object.fromEntries([...times].map(([k, t]) => [k, [median(t.map((x) => x[0])), median(t.map((x) => x[1]))]])),
  };
}

const env = await startAll();
try {
  const { page, context, problems } = await openPage(env, { width, height: width > 600 ? 800 : 740 });
  const cdp = await context.newCDPSession(page);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate });
  const { changed, medians } = await page.evaluate(replay, [variants, replays]);
  if (problems.length) throw new Error(problems.join('\n'));
  console.log(`Style and layout after one edit's changes, ${width} px wide, CPU ${rate}× slower, median of ${replays} replays`);
  console.log(`(the edit changes ${changed.drawing} drawing elements and ${changed.results} result texts):`);
  for (const [k, [w, l]] of Object.entries(medians)) {
    console.log(`  ${k.padEnd(28)} write ${w.toFixed(2).padStart(6)} ms   style+layout ${l.toFixed(2).padStart(6)} ms`);
  }
} finally {
  await env.stop();
}
