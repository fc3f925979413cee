import { expect } from 'chai';
import type { GuardedPage } from './guarded-page.js';

/**
 * The two promises every screen keeps: nothing is fetched from outside the loopback host (the app runs
 * offline), and the console stays free of errors. `expectedErrors` names console errors a test provoked on
 * purpose (a 401 answer is logged by Chromium itself); every other error fails.
 */
export function expectCleanPage(tab: GuardedPage, expectedErrors: readonly RegExp[] = []): void {
  expect(tab.requests.outsideLoopback(), 'requests that left 127.0.0.1').to.deep.equal([]);
  const unexpected = tab.console.errors.filter((error) => !expectedErrors.some((pattern) => pattern.test(error)));
  expect(unexpected, 'console errors').to.deep.equal([]);
}
