import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import type { Page } from 'playwright-core';

/** Git-ignored folder where browser tests leave pictures of each screen for people to look at. */
export const screenshotDir = path.resolve(import.meta.dirname, '../../../test-output/screenshots');

/** Saves the whole page as `<name>.png`; the pointer is moved off the page first so no hover state shows. */
export async function saveScreenshot(page: Page, name: string): Promise<string> {
  await mkdir(screenshotDir, { recursive: true });
  await page.mouse.move(0, 0);
  const file = path.join(screenshotDir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
