import type { Browser } from 'playwright-core';
import { type GuardedPage, openGuardedPage } from './guarded-page.js';
import { signInThroughPage } from './sign-in-through-page.js';

/** A fresh guarded tab signed in through the sign-in page, waiting on the projects list. */
export async function openSignedIn(browser: Browser, baseUrl: string, email: string, password: string): Promise<GuardedPage> {
  const tab = await openGuardedPage(browser, baseUrl);
  await tab.page.goto('/sign-in');
  await signInThroughPage(tab.page, email, password);
  await tab.page.getByRole('heading', { name: 'Projects', level: 1 }).waitFor();
  return tab;
}
