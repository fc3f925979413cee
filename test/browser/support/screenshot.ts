import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import type { Page } from 'playwright-core';

/** Git-ignored folder where browser tests leave pictures of each screen for people to look at. */
export const screenshotDir = path.resolve(import.meta.dirname, '../../../test-output/screenshots');

export async function saveScreenshot(page: Page, name: string): Promise<string> {
  await mkdir(screenshotDir, { recursive: true });
  const file = path.join(screenshotDir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
