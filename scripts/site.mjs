// Builds the site that is served (scripts/serve.mjs, the tests, the benchmarks): a copy of web/
// in target/site with every script and style sheet minified by esbuild (comments, spaces and
// local names out: about 11 kB less gzip on the first view, docs/BENCHMARKS.md), file by file,
// so names, imports and the service worker's precache list stay those of web/.
// The service worker itself is copied as written, with its VERSION set to a hash of the built
// files it precaches: a change to any of them installs a new cache, with nothing to bump by hand.
//
// Usage: node scripts/site.mjs   (after the wasm build; scripts/build runs it)
import { transform } from 'esbuild';
import { createHash } from 'node:crypto';
import { cpSync, readFileSync, readdirSync, realpathSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { extname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = fileURLToPath(new URL('../', import.meta.url));
const WEB = join(ROOT, 'web');
export const SITE = join(ROOT, 'target/site');
const VERSION_LINE = /const VERSION = '[^']*'/;

function filesUnder(dir) {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? filesUnder(path) : [path];
  });
}

/** The service worker's precache list (its `PRECACHE` array of quoted paths). */
function precacheList(swText) {
  const body = swText.match(/const PRECACHE = \[([^\]]*)\]/);
  if (!body) throw new Error('sw.js: no `const PRECACHE = [...]` list');
  return [...body[1].matchAll(/'([^']*)'/g)].map((m) => m[1]);
}

async function minify(path) {
  const loader = extname(path) === '.css' ? 'css' : 'js';
  const source = readFileSync(path, 'utf8');
  // No `format`: an ES module stays an ES module, top-level await included.
  const { code } = await transform(source, { loader, minify: true, target: 'es2022', legalComments: 'none' });
  writeFileSync(path, code);
}

/** Builds target/site from web/ (see the top of this file). */
export async function buildSite() {
  rmSync(SITE, { recursive: true, force: true });
  cpSync(WEB, SITE, { recursive: true });
  const sw = join(SITE, 'sw.js');
  const work = filesUnder(SITE).filter((f) => f !== sw && ['.js', '.css'].includes(extname(f)));
  await Promise.all(work.map(minify));
  // VERSION: sha-256 of every precached file as built (path and bytes), first 12 hex digits.
  const swText = readFileSync(sw, 'utf8');
  const hash = createHash('sha256');
  for (const file of precacheList(swText).filter((f) => f !== './').sort()) {
    hash.update(`${file}\0`).update(readFileSync(join(SITE, file)));
  }
  const version = hash.digest('hex').slice(0, 12);
  if (!VERSION_LINE.test(swText)) throw new Error("sw.js: no `const VERSION = '…'` line");
  writeFileSync(sw, swText.replace(VERSION_LINE, `const VERSION = '${version}'`));
  const rel = relative(ROOT, SITE);
  return `site: ${rel} (${work.length} scripts and style sheets minified, cache version ${version})`;
}

// Run as a command (paths compared resolved: a symlink or a space in the path must not skip it).
if (process.argv[1] && fileURLToPath(import.meta.url) === realpathSync(process.argv[1])) {
  console.log(await buildSite());
}
