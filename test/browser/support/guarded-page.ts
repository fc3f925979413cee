import type { Browser, BrowserContext, Page } from 'playwright-core';
import { type ConsoleLog, recordConsoleErrors } from './console-guard.js';
import { type RequestLog, recordRequests } from './request-guard.js';

/** A fresh browser context (own cookies) with one page whose requests and console errors are recorded. */
export interface GuardedPage {
  readonly context: BrowserContext;
  readonly page: Page;
  readonly requests: RequestLog;
  readonly console: ConsoleLog;
  close(): Promise<void>;
}

/** A laptop screen: the smallest size the app is laid out for. */
export const laptopViewport = { width: 1280, height: 800 };

export async function openGuardedPage(browser: Browser, baseUrl: string): Promise<GuardedPage> {
  // Reduced motion makes Material skip ripples and transitions: steadier steps and screenshots.
  const context = await browser.newContext({ baseURL: baseUrl, viewport: laptopViewport, locale: 'en-GB', reducedMotion: 'reduce' });
  const requests = recordRequests(context);
  const page = await context.newPage();
  const console = recordConsoleErrors(page);
  return { context, page, requests, console, close: () => context.close() };
}
