import { type Browser, chromium } from 'playwright-core';

/** Headless Debian Chromium; playwright-core ships no browser of its own. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu'],
  });
}
