import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import type { Page } from 'playwright-core';

/** Git-ignored folder where browser tests leave pictures of each screen for people to look at. */
export const screenshotDir = path.resolve(import.meta.dirname, '../../../test-output/screenshots');

/**
 * Saves the whole page as `<name>.png`. The pointer is moved off the page first so no hover state shows, and
 * the page is scrolled to the top so the sticky toolbar is drawn where it belongs.
 */
export async function saveScreenshot(page: Page, name: string): Promise<string> {
  await mkdir(screenshotDir, { recursive: true });
  await page.mouse.move(0, 0);
  await page.evaluate('window.scrollTo(0, 0)');
  const file = path.join(screenshotDir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Widths the main screens are checked at: the laptop the app is laid out for, and a common desktop. */
export const reviewWidths = [1280, 1440] as const;

/** Saves `<name>.png` at the page's own width and `<name>-1440.png` at 1440 pixels wide, then restores the size. */
export async function saveScreenshots(page: Page, name: string): Promise<void> {
  await saveScreenshot(page, name);
  const size = page.viewportSize();
  if (!size) return;
  await page.setViewportSize({ width: reviewWidths[1], height: size.height });
  await page.waitForTimeout(300);
  await saveScreenshot(page, `${name}-${reviewWidths[1]}`);
  await page.setViewportSize(size);
}
