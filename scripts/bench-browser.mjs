// Browser benchmark of the page: with the CPU throttled 4× (Chromium CDP
// Emulation.setCPUThrottlingRate), the time from an input event to the updated page (the input
// handler — wasm evaluate, drawing, tables — plus the style and layout it causes), median and
// p95 over N edits; and the bytes the page loads, per file and gzipped in total.
// Usage: node scripts/bench-browser.mjs [--edits N]   (after scripts/build)
import { gzipSync } from 'node:zlib';
import { writeFileSync, mkdirSync } from 'node:fs';
import { startAll, openPage, ROOT } from '../tests/browser/harness.mjs';

const arg = process.argv.indexOf('--edits');
const EDITS = arg > 0 ? Number(process.argv[arg + 1]) : 200;

// Edits a person makes: frame numbers, setup, changes, rider, each with a few values.
const EDITS_CYCLE = [
  ['frame.reach_mm', ['465', '470', '47,5 cm', '480']],
  ['frame.head_angle_deg', ['64', '64,5°', '65', '65.5']],
  ['frame.stack_mm', ['630', '635', '640']],
  ['setup.stem_mm', ['35', '45', '50']],
  ['setup.spacers_mm', ['0', '10', '20']],
  ['changes.fork_travel_mm', ['150']],
  ['changes.front_sag_pct', ['15', '20', '25']],
  ['rider.height_mm', ['1750', '1780', '1810']],
];

function quantile(sorted, q) {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i];
}

const env = await startAll();
const loaded = new Map();
try {
  const { page, context, problems } = await openPage(env, { width: 360, height: 740 });
  page.on('response', () => {});
  // Bytes: every file the page requested, read back from the server.
  const urls = await page.evaluate(() => [location.href, ...performance.getEntriesByType('resource').map((e) => e.name)]);
  for (const url of urls) {
    const body = Buffer.from(await (await fetch(url)).arrayBuffer());
    const name = new URL(url).pathname.replace(/^\//, '') || 'index.html';
    loaded.set(name, { raw: body.length, gz: gzipSync(body, { level: 9 }).length });
  }
  const cdp = await context.newCDPSession(page);
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
  const handler = [];
  const total = [];
  for (let i = 0; i < EDITS; i += 1) {
    const [name, values] = EDITS_CYCLE[i % EDITS_CYCLE.length];
    const value = values[Math.floor(i / EDITS_CYCLE.length) % values.length];
    const [h, t] = await page.evaluate(([n, v]) => {
      const input = document.querySelector(`[name="${n}"]`);
      input.value = v;
      const t0 = performance.now();
      input.dispatchEvent(new Event('input', { bubbles: true }));
      const t1 = performance.now();
      void document.body.offsetHeight; // style and layout of the updated page
      void document.querySelector('#drawing svg').getBBox();
      const t2 = performance.now();
      return [t1 - t0, t2 - t0];
    }, [name, value]);
    handler.push(h);
    total.push(t);
  }
  await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
  if (problems.length) throw new Error(problems.join('\n'));
  handler.sort((a, b) => a - b);
  total.sort((a, b) => a - b);
  const gzTotal = [...loaded.values()].reduce((a, f) => a + f.gz, 0);
  const rawTotal = [...loaded.values()].reduce((a, f) => a + f.raw, 0);
  const result = {
    edits: EDITS,
    cpu_throttle: 4,
    handler_ms: { median: quantile(handler, 0.5), p95: quantile(handler, 0.95), max: handler.at(-1) },
    input_to_updated_page_ms: { median: quantile(total, 0.5), p95: quantile(total, 0.95), max: total.at(-1) },
    files: Object.fromEntries(loaded),
    total_bytes: rawTotal,
    total_gzip_bytes: gzTotal,
  };
  mkdirSync(`${ROOT}target`, { recursive: true });
  writeFileSync(`${ROOT}target/bench-browser.json`, JSON.stringify(result, null, 2));
  const f = (v) => v.toFixed(2);
  console.log(`Page update, CPU throttled 4×, ${EDITS} edits (Chromium ${env.browser.version()}):`);
  console.log(`  input → updated page (handler + style/layout): median ${f(result.input_to_updated_page_ms.median)} ms, p95 ${f(result.input_to_updated_page_ms.p95)} ms, max ${f(result.input_to_updated_page_ms.max)} ms`);
  console.log(`  input handler alone:                         median ${f(result.handler_ms.median)} ms, p95 ${f(result.handler_ms.p95)} ms`);
  console.log('Bytes loaded:');
  for (const [name, b] of loaded) console.log(`  ${name.padEnd(28)} ${String(b.raw).padStart(8)} B  ${String(b.gz).padStart(7)} B gz`);
  console.log(`  ${'total'.padEnd(28)} ${String(rawTotal).padStart(8)} B  ${String(gzTotal).padStart(7)} B gz`);
  await context.close();
} finally {
  await env.stop();
}
