// Helpers shared by the page tests: read a number from the result tables, wait for one, zoom
// the drawing.
import assert from 'node:assert/strict';
import { settled } from './harness.mjs';

/** The number in a result cell (minus sign written as U+2212). */
export async function cell(page, key, col = 'ridden') {
  await settled(page);
  const text = await page.locator(`#results tr[data-key="${key}"] td[data-col="${col}"]`).first().textContent();
  return Number.parseFloat(text.replace('−', '-').replace(/[^0-9.+-]/g, ''));
}

export async function waitCell(page, key, want, tol, col = 'ridden') {
  await page.waitForFunction(([k, c, w, t]) => {
    const td = document.querySelector(`#results tr[data-key="${k}"] td[data-col="${c}"]`);
    return td && Math.abs(Number.parseFloat(td.textContent.replace('−', '-').replace(/[^0-9.+-]/g, '')) - w) <= t;
  }, [key, col, want, tol], { timeout: 5000 }).catch(() => {});
  const got = await cell(page, key, col);
  assert.ok(Math.abs(got - want) <= tol, `${key} (${col}) shown ${got}, formula ${want}`);
}


/**
 * Ctrl-wheel-zooms into the middle of the drawing; returns its viewBox before (`fit`) and after
 * (`zoomed`), and its box.
 */
export async function zoomIn(page) {
  const svg = page.locator('#drawing svg');
  const fit = await svg.getAttribute('viewBox');
  const box = await svg.boundingBox();
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.keyboard.down('Control'); // a plain wheel scrolls the page (web/ui/zoom.js)
  await page.mouse.wheel(0, -400);
  await page.keyboard.up('Control');
  return { fit, zoomed: await svg.getAttribute('viewBox'), box };
}

/**
 * Shows every layer of the drawing once (dimensions, the other posture, the ghost) and returns
 * to the view it had: values that waited in a hidden layer (web/ui/drawing.js) are then written,
 * so the drawing's markup is complete.
 */
export async function showEveryLayer(page) {
  const flip = async (sel) => {
    await page.locator(sel).click();
    await page.locator(sel).click();
  };
  await flip('label.toggle:has(#show-dims)');
  await flip('label.toggle:has(#show-ghost)');
  const standing = await page.locator('#posture-standing').isChecked();
  await page.locator(`label[for="posture-${standing ? 'seated' : 'standing'}"]`).click();
  await page.locator(`label[for="posture-${standing ? 'standing' : 'seated'}"]`).click();
}
