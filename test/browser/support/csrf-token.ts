import type { Page } from 'playwright-core';

/** The anti-forgery token the page holds (cookie XSRF-TOKEN), as a forged request from the page would send it. */
export async function csrfTokenOf(page: Page): Promise<string> {
  const cookies = await page.context().cookies();
  const token = cookies.find((cookie) => cookie.name === 'XSRF-TOKEN')?.value;
  if (!token) throw new Error('the page holds no XSRF-TOKEN cookie');
  return decodeURIComponent(token);
}
