import type { Page } from 'playwright-core';

/** Console errors and uncaught exceptions of one page, each as "text (source url)". */
export interface ConsoleLog {
  readonly errors: readonly string[];
}

export function recordConsoleErrors(page: Page): ConsoleLog {
  const errors: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(`${message.text()} (${message.location().url || 'no source'})`);
  });
  page.on('pageerror', (error) => errors.push(`uncaught: ${error.message}`));
  return { errors };
}
