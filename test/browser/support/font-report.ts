import type { Page } from 'playwright-core';

export interface FontReport {
  /** Computed font-family of <body>: shows whether the global stylesheet was applied. */
  bodyFont: string;
  /** Families of the font faces the page has finished loading. */
  loaded: string[];
}

// Written as a string because the Node type check has no DOM library; it runs in the page.
const readFonts = `(async () => {
  await document.fonts.ready;
  return {
    bodyFont: getComputedStyle(document.body).fontFamily,
    loaded: [...document.fonts].filter((face) => face.status === 'loaded').map((face) => face.family.replace(/"/g, '')),
  };
})()`;

/** Which fonts the page ended up with, once the browser finished loading them. */
export function readFontReport(page: Page): Promise<FontReport> {
  return page.evaluate<FontReport>(readFonts);
}
