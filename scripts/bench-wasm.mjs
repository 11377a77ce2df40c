// Times the page's wasm calls as the page makes them on an edit (`evaluate_field_page`; older
// builds: the whole form as JSON text to `evaluate_form_page` or `evaluate_form_linked`) and the
// drawing (`drawing_changes` since the answer applied last) in Node's V8 (the engine of the page's Chromium), for one or more builds of
// web/pkg side by side: each round runs a batch of 20 edits through every build in turn, so all
// builds see the same machine load.
// Edits: "frame" = reach or head angle (the frame is solved again), "other" = stem, rider height,
// fork length change or spacers (the remembered solve is reused).
// Usage: node scripts/bench-wasm.mjs [--rounds N] [pkg dir …]   (default: web/pkg)
// The form is the page's demo form as the page sends it (scripts/bench-wasm-form.json).
// Copy a build aside (cp -r web/pkg /tmp/pkg-x) to compare it with a later one.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

const args = process.argv.slice(2);
const at = args.indexOf('--rounds');
const rounds = at >= 0 ? Number(args.splice(at, 2)[1]) : 60;
const dirs = (args.length ? args : ['web/pkg']).map((d) => resolve(d));
const fields = JSON.parse(readFileSync(new URL('./bench-wasm-form.json', import.meta.url), 'utf8'));
const view = JSON.stringify({ posture: 'seated', dimensions: false, ghost: true });
const builds = [];
for (const d of dirs) {
  const w = await import(pathToFileURL(`${d}/framewise.js`).href);
  await w.default({ module_or_path: readFileSync(`${d}/framewise_bg.wasm`) });
  builds.push(w);
}
const kinds = {
  frame: ['frame.reach_mm', 'frame.head_angle_deg'],
  other: ['setup.stem_mm', 'rider.height_mm', 'changes.fork_a2c_delta_mm', 'setup.spacers_mm'],
};
const warm = 5;
const times = {};
// Per build: the form the page holds (edits accumulate, as a person's do), the number of the form
// the module holds (builds with `evaluate_field_page`) and the drawing answer applied last.
const state = builds.map(() => ({ form: { ...fields }, held: 0, shown: 0 }));
let i = 0;
for (let r = 0; r < rounds + warm; r++) {
  for (const [kind, names] of Object.entries(kinds)) {
    const edits = [];
    for (let j = 0; j < 20; j++, i++) {
      const name = names[i % names.length];
      edits.push([name, String((parseFloat(fields[name]) || 0) + 1 + (i % 5))]);
    }
    builds.forEach((w, k) => {
      // "evaluate": the handler's call as the page makes it: one field to the form the module
      // holds (`evaluate_field_page`), else the whole form written as JSON text here
      // (`evaluate_form_page`; older builds: `evaluate_form_linked`, with the link);
      // "+ drawing": with the drawing's changes since the answer applied last
      // (`drawing_changes(shown)`, read as the page reads it) or `drawing_patch` (older builds;
      // the oldest made the drawing inside `evaluate_form_linked`).
      const st = state[k];
      for (const withDrawing of [false, true]) {
        const t0 = process.hrtime.bigint();
        for (const [name, value] of edits) {
          st.form[name] = value;
          let answer = st.held ? w.evaluate_field_page(st.held, name, value, view) : 'null';
          if (answer === 'null' && w.evaluate_form_page) {
            answer = w.evaluate_form_page(JSON.stringify(st.form), view);
            if (w.page_form_seq) st.held = w.page_form_seq();
          } else if (answer === 'null') w.evaluate_form_linked(JSON.stringify(st.form), view);
          if (withDrawing && w.drawing_changes) st.shown = JSON.parse(w.drawing_changes(st.shown))?.seq ?? 0;
          else if (withDrawing && w.drawing_patch) w.drawing_patch();
        }
        const ms = Number(process.hrtime.bigint() - t0) / 1e6 / edits.length;
        const what = withDrawing ? 'evaluate + drawing' : 'evaluate';
        if (r >= warm) (times[`${dirs[k]} ${kind} ${what}`] ??= []).push(ms);
      }
    });
  }
}
console.log('ms per call (mean of a batch of 20 edits); min, median, 90th percentile over rounds');
for (const [key, a] of Object.entries(times)) {
  a.sort((x, y) => x - y);
  const q = (p) => a[Math.min(a.length - 1, Math.floor(a.length * p))].toFixed(3);
  console.log(`${key}  min ${q(0)}  median ${q(0.5)}  p90 ${q(0.9)}`);
}
