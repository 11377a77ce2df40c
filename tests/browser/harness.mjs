// Shared set-up for the browser tests: a static server on a free port and headless Chromium
// (Debian's /usr/bin/chromium driven by playwright-core). Page errors and console errors fail
// the test that caused them.
import { chromium } from 'playwright-core';
import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { startServer } from '../../scripts/serve.mjs';
import { buildSite, SITE } from '../../scripts/site.mjs';

export const ROOT = fileURLToPath(new URL('../../', import.meta.url));
export const SHOTS = `${ROOT}target/screenshots`;
/** The served site: web/ as scripts/build makes it (scripts/site.mjs). */
export { SITE };

export const CHROMIUM_ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-quic',
  '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

/** Builds the site from web/ as it is now (a second: so an edit in web/ is what is tested), then
 * serves it and starts Chromium. */
export async function startAll() {
  await buildSite();
  const server = await startServer({ root: SITE, port: 0 });
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
  const base = `http://127.0.0.1:${server.address().port}/`;
  mkdirSync(SHOTS, { recursive: true });
  return {
    base,
    browser,
    async stop() {
      await browser.close();
      await new Promise((ok) => server.close(ok));
    },
  };
}

/** Opens the page at the given viewport; returns the page and the list of problems it logged. */
export async function openPage(env, { width = 1280, height = 800, hash = '' } = {}) {
  const context = await env.browser.newContext({ viewport: { width, height } });
  const page = await context.newPage();
  const problems = [];
  page.on('pageerror', (e) => problems.push(`page error: ${e.message}`));
  page.on('console', (m) => { if (m.type() === 'error') problems.push(`console error: ${m.text()}`); });
  await page.goto(env.base + hash);
  await page.waitForSelector('html[data-ready="true"]', { timeout: 15000 });
  return { page, context, problems };
}

/** Waits until the page has written every queued part (web/ui/onscreen.js clears data-stale). */
export async function settled(page) {
  await page.waitForSelector('html:not([data-stale])', { state: 'attached', timeout: 5000 });
}

/**
 * A screenshot of the page (or of `target`, a locator) once it has drawn what a scroll brought
 * on the screen: parts with `content-visibility: auto` (style.css) are drawn in the frame after
 * they come near the screen, so a screenshot taken straight after `scrollIntoViewIfNeeded` can
 * show them blank. Waits two animation frames first.
 */
export async function shot(page, path, options = {}, target = page) {
  await frames(page);
  await target.screenshot({ path, ...options });
}

/** Waits two animation frames: the page has drawn what the last change brought on the screen. */
export async function frames(page) {
  await page.evaluate(() => new Promise((ok) => requestAnimationFrame(() => requestAnimationFrame(ok))));
}

/**
 * The page's share link as the link box shows it, brought up to date first: the address follows
 * the page once typing pauses (web/ui/share.js), and the link box's focus brings it up to date
 * at once, as it does for a person who taps the box. A focus event, not a focus: the page does
 * not scroll.
 */
export async function linkOf(page) {
  return page.evaluate(() => {
    const box = document.getElementById('share-url');
    box.dispatchEvent(new FocusEvent('focus'));
    return box.value;
  });
}
