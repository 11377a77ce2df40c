// Draws the PNG icons of the web app manifest from web/icon.svg with headless Chromium, then
// re-encodes them as 8-bit palette PNGs with pngquant (`apt-get install pngquant`; about half
// the bytes of Chromium's 32-bit PNGs, the same picture to the eye).
// Run after changing the icon: node scripts/make-icons.mjs (the PNGs are committed).
import { chromium } from 'playwright-core';
import { readFileSync, mkdirSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { CHROMIUM_ARGS } from '../tests/browser/harness.mjs';

const root = new URL('../web/', import.meta.url);
const svg = readFileSync(new URL('icon.svg', root), 'utf8');
// The maskable icon keeps the drawing inside the central 80 % safe zone on a full-bleed ground.
const inner = svg.replace(/^<svg[^>]*>/, '').replace(/<\/svg>\s*$/, '').replace(/<rect[^>]*\/>/, '');
const maskable = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 64 64"><rect width="64" height="64" fill="#0a6e69"/><g transform="translate(12.8 12.8) scale(0.6)">${inner}</g></svg>`;

const out = new URL('icons/', root);
mkdirSync(out, { recursive: true });
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
const page = await browser.newPage();
for (const [name, source, size] of [
  ['icon-192.png', svg, 192], ['icon-512.png', svg, 512], ['icon-maskable-512.png', maskable, 512],
]) {
  await page.setViewportSize({ width: size, height: size });
  const data = `data:image/svg+xml;base64,${Buffer.from(source).toString('base64')}`;
  await page.setContent(`<body style="margin:0;background:transparent"><img src="${data}" width="${size}" height="${size}"></body>`);
  await page.locator('img').screenshot({ path: new URL(name, out).pathname, omitBackground: true });
  // Palette re-encode in place: quality 80–100 keeps the flat colours exact and the edges smooth.
  const path = new URL(name, out).pathname;
  const quant = spawnSync('pngquant', ['--force', '--strip', '--skip-if-larger', '--speed', '1',
    '--quality', '80-100', '--output', path, '--', path], { stdio: 'inherit' });
  if (quant.error || ![0, 98, 99].includes(quant.status)) {
    console.warn(`pngquant did not run (${quant.error?.message ?? quant.status}): ${name} stays 32-bit`);
  }
  console.log(`web/icons/${name}`);
}
await browser.close();
