// Builds the site that is served (scripts/serve.mjs, the tests, the benchmarks): a copy of web/
// in target/site with every style sheet and script minified by esbuild (comments, spaces and
// local names out: about 11 kB less gzip on the first view, docs/BENCHMARKS.md), and app.js
// bundled with every module it imports (web/ui/*.js and the wasm glue pkg/framewise.js): one
// request instead of 13 and about 2.7 kB less gzip. The bundled modules are left out of the site.
// The on-demand module (pkg/framewise_extras.js) stays a file of its own, loaded when needed.
// The service worker is copied as written, with its PRECACHE list set to the built site's files
// and its VERSION to a hash of them: a change to any of them installs a new cache, with nothing
// to bump by hand.
//
// Usage: node scripts/site.mjs   (after the wasm build; scripts/build runs it)
import { build, transform } from 'esbuild';
import { createHash } from 'node:crypto';
import { cpSync, readFileSync, readdirSync, realpathSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { extname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = fileURLToPath(new URL('../', import.meta.url));
const WEB = join(ROOT, 'web');
export const SITE = join(ROOT, 'target/site');
const VERSION_LINE = /const VERSION = '[^']*'/;
const PRECACHE_LIST = /const PRECACHE = \[[^\]]*\]/;

function filesUnder(dir) {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? filesUnder(path) : [path];
  });
}

// FRAMEWISE_READABLE=1 keeps names and lines (for a profile; never for the published site).
const READABLE = process.env.FRAMEWISE_READABLE === '1';

async function minify(path) {
  const loader = extname(path) === '.css' ? 'css' : 'js';
  const source = readFileSync(path, 'utf8');
  // No `format`: an ES module stays an ES module, top-level await included.
  const { code } = await transform(source, { loader, minify: !READABLE, target: 'es2022', legalComments: 'none' });
  writeFileSync(path, code);
}

/** app.js with every module it imports, minified; returns the site paths of the modules bundled. */
async function bundleApp() {
  const { outputFiles, metafile } = await build({
    entryPoints: [join(WEB, 'app.js')], bundle: true, format: 'esm', minify: !READABLE, target: 'es2022',
    legalComments: 'none', write: false, metafile: true, absWorkingDir: ROOT,
  });
  const [out] = outputFiles;
  writeFileSync(join(SITE, 'app.js'), out.contents);
  return Object.keys(metafile.inputs).map((input) => relative(WEB, join(ROOT, input)));
}

/** Builds target/site from web/ (see the top of this file). */
export async function buildSite() {
  rmSync(SITE, { recursive: true, force: true });
  cpSync(WEB, SITE, { recursive: true });
  const sw = join(SITE, 'sw.js');
  const work = filesUnder(SITE).filter((f) => f !== sw && ['.js', '.css'].includes(extname(f)));
  await Promise.all(work.map(minify));
  const bundled = await bundleApp();
  for (const file of bundled.filter((f) => f !== 'app.js')) rmSync(join(SITE, file));
  // PRECACHE: the shell and every file of the built site but the worker; VERSION: sha-256 of
  // each of them as built (path and bytes), first 12 hex digits.
  const files = filesUnder(SITE).filter((f) => f !== sw).map((f) => relative(SITE, f)).sort();
  const hash = createHash('sha256');
  for (const file of files) hash.update(`${file}\0`).update(readFileSync(join(SITE, file)));
  const version = hash.digest('hex').slice(0, 12);
  let swText = readFileSync(sw, 'utf8');
  if (!VERSION_LINE.test(swText)) throw new Error("sw.js: no `const VERSION = '…'` line");
  if (!PRECACHE_LIST.test(swText)) throw new Error('sw.js: no `const PRECACHE = [...]` list');
  const list = ['./', ...files].map((f) => `'${f}'`).join(', ');
  swText = swText.replace(VERSION_LINE, `const VERSION = '${version}'`).replace(PRECACHE_LIST, `const PRECACHE = [${list}]`);
  writeFileSync(sw, swText);
  const rel = relative(ROOT, SITE);
  return `site: ${rel} (${work.length} scripts and style sheets minified, app.js bundled with ${bundled.length - 1} modules, cache version ${version})`;
}

// Run as a command (paths compared resolved: a symlink or a space in the path must not skip it).
if (process.argv[1] && fileURLToPath(import.meta.url) === realpathSync(process.argv[1])) {
  console.log(await buildSite());
}
