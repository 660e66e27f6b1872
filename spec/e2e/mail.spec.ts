import type { Page } from 'playwright-core';
import { launchContext } from './support/browser';
import { type E2eServer, useE2eServer } from './support/server';

const PASSWORD = 'loftline-demo';

async function signIn(page: Page, baseUrl: string, email: string, password = PASSWORD): Promise<void> {
  await page.goto(baseUrl + '/sign-in');
  await page.getByLabel('E-mail', { exact: true }).fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/**
 * Opens Captured mail as the signed-in admin, refreshing until a message with this subject part
 * and recipient arrives (the outbox sends in the background), opens it and returns the first
 * link of its text part as a path on the server under test.
 */
async function linkFromCapturedMail(page: Page, baseUrl: string, subject: RegExp, to: string): Promise<string> {
  await page.goto(baseUrl + '/admin/mail');
  const message = page.locator('ll-captured-mail mat-nav-list a').filter({ hasText: subject }).filter({ hasText: to });
  const deadline = Date.now() + 20_000;
  while ((await message.count()) === 0) {
    if (Date.now() > deadline) throw new Error(`no captured mail "${subject}" to ${to}`);
    await page.getByRole('button', { name: 'Refresh' }).click();
    await page.waitForTimeout(300);
  }
  await message.first().click();
  const frame = page.locator('ll-mail-reader iframe');
  await frame.waitFor();
  // The HTML part is drawn in a frame with every sandbox permission withheld.
  expect(await frame.getAttribute('sandbox')).toBe('');
  await page.getByRole('tab', { name: 'Text' }).click();
  const href = await page.locator('ll-mail-reader .reader__text a').first().getAttribute('href');
  if (!href) throw new Error('the captured mail has no link');
  const url = new URL(href);
  return url.pathname + url.search;
}

describe('account mail through the UI (end to end, Chromium)', () => {
  let server: E2eServer;
  useE2eServer((started) => (server = started));

  it('invites a guardian, who sets a password from the mailed link and lands on Guardian home', async () => {
    const admin = await launchContext();
    const guardian = await launchContext({ width: 360, height: 740 });
    try {
      const page = await admin.context.newPage();
      await signIn(page, server.baseUrl, 'admin@kestrel-vale.test');
      await page.goto(server.baseUrl + '/admin/invites');
      await page.getByLabel('E-mail', { exact: true }).fill('new.guardian@example.org');
      await page.getByLabel('Display name').fill('Robin Example');
      await page.getByRole('combobox', { name: 'Child' }).click();
      const child = page.getByRole('option').first();
      const childName = (await child.innerText()).trim();
      await child.click();
      await page.getByRole('button', { name: /Send invitation/ }).click();
      await page.getByText('Invitation sent to new.guardian@example.org').waitFor();

      const link = await linkFromCapturedMail(page, server.baseUrl, /invit/i, 'new.guardian@example.org');
      expect(link).toMatch(/^\/accept-invite\?token=/);

      const invited = await guardian.context.newPage();
      await invited.goto(server.baseUrl + link);
      await invited.getByText('new.guardian@example.org').waitFor();
      expect(await invited.getByText('Robin Example').count()).toBe(1);
      await invited.getByLabel('New password', { exact: true }).fill('a long new password');
      await invited.getByLabel('Repeat the new password', { exact: true }).fill('a long new password');
      await invited.getByRole('button', { name: /Set password and sign in/ }).click();
      await invited.waitForURL(/\/guardian$/);
      await invited.getByRole('heading', { name: 'Guardian home' }).waitFor();
      await invited.getByRole('heading', { name: childName.split(' ')[0], exact: true }).waitFor();

      // The link worked once: opening it again says so.
      const again = await guardian.context.newPage();
      await again.goto(server.baseUrl + link);
      await again.getByRole('alert').waitFor();
      expect(await again.getByLabel('New password', { exact: true }).count()).toBe(0);
    } finally {
      await admin.close();
      await guardian.close();
    }
  }, 120_000);

  it('resets a forgotten password from the sign-in page through the mailed link', async () => {
    const admin = await launchContext();
    const player = await launchContext({ width: 360, height: 740 });
    try {
      const forgetful = await player.context.newPage();
      await forgetful.goto(server.baseUrl + '/sign-in');
      await forgetful.getByRole('link', { name: 'Forgot your password?' }).click();
      await forgetful.waitForURL(/\/forgot-password$/);
      await forgetful.getByLabel('E-mail', { exact: true }).fill('player@kestrel-vale.test');
      await forgetful.getByRole('button', { name: 'Send me a link' }).click();
      const neutral = await forgetful.getByRole('status').innerText();

      // An unknown address gets the very same answer.
      await forgetful.getByRole('button', { name: 'Use another address' }).click();
      await forgetful.getByLabel('E-mail', { exact: true }).fill('nobody@kestrel-vale.test');
      await forgetful.getByRole('button', { name: 'Send me a link' }).click();
      expect(await forgetful.getByRole('status').innerText()).toBe(neutral);

      const page = await admin.context.newPage();
      await signIn(page, server.baseUrl, 'admin@kestrel-vale.test');
      const link = await linkFromCapturedMail(page, server.baseUrl, /password/i, 'player@kestrel-vale.test');
      expect(link).toMatch(/^\/reset-password\?token=/);

      await forgetful.goto(server.baseUrl + link);
      await forgetful.getByLabel('New password', { exact: true }).fill('another long password');
      await forgetful.getByLabel('Repeat the new password', { exact: true }).fill('another long password');
      await forgetful.getByRole('button', { name: 'Save new password' }).click();
      await forgetful.getByText('Your password has been changed.').waitFor();
      await forgetful.getByRole('link', { name: 'Go to sign in' }).click();
      await forgetful.waitForURL(/\/sign-in$/);
      await signIn(forgetful, server.baseUrl, 'player@kestrel-vale.test', 'another long password');
      expect(new URL(forgetful.url()).pathname).toBe('/home');
    } finally {
      await admin.close();
      await player.close();
    }
  }, 120_000);
});
