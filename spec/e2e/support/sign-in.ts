/** Signing in through the real sign-in page, as a person would, for the end-to-end specs. */
import type { Page } from 'playwright-core';

/** The demo scenario's password (demo database only). */
export const DEMO_PASSWORD = 'loftline-demo';

/** Opens the app signed out, is sent to the sign-in page, signs in and waits to leave it. */
export async function signInThroughUi(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(baseUrl + '/');
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}
