import type { Page } from 'playwright-core';

/** Fills the sign-in form the way a person does (labels, then the button) and submits it. */
export async function signInThroughPage(page: Page, email: string, password: string): Promise<void> {
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}
