/**
 * Accessibility end to end: axe-core (the npm package) on every screen of the production build,
 * in the light and the dark theme, failing on any serious or critical violation of WCAG 2.2 AA;
 * and sign-in and Pitchside logging done with the keyboard alone.
 *
 * One server and one browser context for the whole file; each screen is opened once and audited
 * in both themes by switching the emulated colour-scheme preference, which the app follows.
 */
import Database from 'better-sqlite3';
import type { BrowserContext, Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { auditInBothThemes, formatViolations, runAxe } from './support/axe';
import { launchContext } from './support/browser';
import { startE2eServer, type E2eServer } from './support/server';
import { until } from './support/waiting';
import { DEMO_PASSWORD, signInThroughUi } from './support/sign-in';

/** Pitchside is read in sunlight: text there must reach 7:1, not only 4.5:1. */
const PITCHSIDE = { pitchside: true };

/** Minor and moderate findings, printed once at the end (they do not fail the spec). */
const notes: string[] = [];

/** Presses Tab until `isTarget` holds for the focused element; fails after `max` presses. */
async function tabTo(page: Page, what: string, isTarget: () => Promise<boolean>, max = 60): Promise<void> {
  for (let i = 0; i < max; i++) {
    await page.keyboard.press('Tab');
    if (await isTarget()) return;
  }
  throw new Error(`Tab never reached ${what} in ${max} presses`);
}

/** Whether the focused element matches the selector. */
function focusedMatches(page: Page, selector: string): Promise<boolean> {
  return page.evaluate((s) => document.activeElement?.matches(s) ?? false, selector);
}

describe('accessibility (end to end, Chromium, axe-core, WCAG 2.2 AA)', () => {
  let server: E2eServer;
  let context: BrowserContext;
  let closeBrowser: () => Promise<void>;
  let page: Page;
  let inviteLink = '';

  /**
   * Waits for the screen to settle, audits it in both themes and fails on blocking findings.
   * Pitchside screens (`pitchside: true`) must also keep text at 7:1 for sunlight.
   */
  async function audit(screen: string, options: { pitchside?: boolean } = {}): Promise<void> {
    await page.locator('h1').first().waitFor();
    await page.waitForLoadState('networkidle');
    // Loading indicators go once the data is in; a screen still loading after 10 s is audited as it is.
    await page
      .waitForFunction(() => !document.querySelector('mat-progress-bar, mat-progress-spinner, mat-spinner'), null, { timeout: 10_000 })
      .catch(() => undefined);
    for (const result of await auditInBothThemes(page, { enhancedContrast: options.pitchside })) {
      const where = `${screen} (${result.theme} theme)`;
      // WCAG 2.2 AA via axe-core: no serious or critical violations.
      expect(result.blocking.length).withContext(formatViolations(where, result.blocking)).toBe(0);
      // WCAG 2.2 SC 1.1.1 Non-text Content: every chart or drawing is named or hidden.
      expect(result.unnamedGraphics).withContext(`${where}: graphics without an accessible name`).toEqual([]);
      if (result.minor.length > 0) notes.push(formatViolations(where, result.minor));
    }
  }

  /** Opens a path in the app and audits it. */
  async function visit(path: string, screen: string, options: { pitchside?: boolean } = {}): Promise<void> {
    await page.goto(server.baseUrl + path);
    await audit(screen, options);
  }

  async function signOut(): Promise<void> {
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
  }

  beforeAll(async () => {
    server = await startE2eServer();
    ({ context, close: closeBrowser } = await launchContext());
    page = await context.newPage();
  }, 90_000);

  afterAll(async () => {
    if (notes.length > 0) console.log(`\n  axe minor/moderate findings (not failing):\n${notes.join('\n')}`);
    await closeBrowser?.();
    await server?.stop();
    server?.cleanup();
  });

  it('has a live checker: axe reports a violation planted in the page', async () => {
    await page.goto(server.baseUrl + '/sign-in');
    await page.locator('h1').first().waitFor();
    // WCAG 2.2 SC 1.4.3 Contrast (Minimum): light grey on white is about 1.1:1.
    await page.evaluate(() => {
      const probe = document.createElement('p');
      probe.id = 'axe-probe';
      probe.textContent = 'Planted low-contrast text';
      probe.style.cssText = 'color:#eeeeee;background:#ffffff';
      document.body.append(probe);
    });
    const found = await runAxe(page);
    await page.evaluate(() => document.getElementById('axe-probe')?.remove());
    expect(found.find((v) => v.id === 'color-contrast')?.targets).toEqual(['#axe-probe']);
  }, 60_000);

  it('signs in with the keyboard alone (Tab, typing, Enter)', async () => {
    await page.goto(server.baseUrl + '/sign-in');
    await page.locator('h1').first().waitFor();
    // WCAG 2.2 SC 2.1.1 Keyboard; SC 2.4.3 Focus Order: e-mail, then password.
    await tabTo(page, 'the e-mail field', () => focusedMatches(page, 'input[autocomplete="username"]'));
    await page.keyboard.type(DEMO_ACCOUNTS.admin);
    await page.keyboard.press('Tab');
    const onPassword = await focusedMatches(page, 'input[autocomplete="current-password"]');
    expect(onPassword).withContext('Tab from e-mail reaches the password').toBeTrue();
    await page.keyboard.type(DEMO_PASSWORD);
    await page.keyboard.press('Enter');
    await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
    await page.getByRole('heading', { level: 1, name: /Hello/ }).waitFor();
  }, 60_000);

  it('passes on the club admin screens, including a sent invitation in Captured mail', async () => {
    await audit('Home (admin)');
    await visit('/admin/guardians', 'Club admin · Guardians');
    await visit('/admin/invites', 'Club admin · Invitations');
    await page.getByLabel('E-mail', { exact: true }).fill('axe.guardian@example.org');
    await page.getByLabel('Display name').fill('Avery Example');
    await page.getByRole('combobox', { name: 'Child' }).click();
    await page.getByRole('option').first().click();
    await page.getByRole('button', { name: /Send invitation/ }).click();
    await page.getByText('Invitation sent to axe.guardian@example.org').waitFor();
    await audit('Club admin · Invitations (sent)');
    await visit('/admin/outbox', 'Club admin · Outbox');

    await page.goto(server.baseUrl + '/admin/mail');
    const message = page.locator('ll-captured-mail mat-nav-list a').filter({ hasText: 'axe.guardian@example.org' });
    const deadline = Date.now() + 20_000;
    while ((await message.count()) === 0) {
      if (Date.now() > deadline) throw new Error('the invitation never reached Captured mail');
      await page.getByRole('button', { name: 'Refresh' }).click();
      await page.waitForTimeout(300);
    }
    await message.first().click();
    await page.locator('ll-mail-reader iframe').waitFor();
    await audit('Club admin · Captured mail (message open)');
    await page.getByRole('tab', { name: 'Text' }).click();
    const href = await page.locator('ll-mail-reader .reader__text a').first().getAttribute('href');
    inviteLink = href ? new URL(href).pathname + new URL(href).search : '';

    await visit('/imports/kicks', 'Imports · Measured kicks');
    await visit('/imports/roster', 'Imports · Roster');
    await visit('/imports/exports', 'Imports · Kick exports');
    await visit('/imports/data-requests', 'Imports · Data requests');
    await signOut();
  }, 150_000);

  it('passes on the signed-out pages (sign-in with errors, password and invitation links, unsubscribe)', async () => {
    await visit('/sign-in', 'Sign in');
    await page.getByRole('button', { name: /sign in/i }).click();
    await page.getByText('Enter your e-mail address').waitFor();
    await audit('Sign in (errors showing)');
    await visit('/forgot-password', 'Forgot your password');
    await visit('/reset-password?token=not-a-real-token', 'Choose a new password');
    await visit('/reset-password', 'Choose a new password (incomplete link)');
    expect(inviteLink).toMatch(/^\/accept-invite\?token=/);
    await page.goto(server.baseUrl + inviteLink);
    await page.getByText('axe.guardian@example.org').waitFor();
    await audit('Set your password (invitation)');
    await visit('/unsubscribe?token=not-a-real-token', 'Stop the Family digest');
  }, 120_000);

  it('passes on the head coach analysis screens: Squad week, Player file, sandbox, planner', async () => {
    await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.head_coach);
    await audit('Home (head coach)');
    await visit('/squad-week', 'Squad week');
    const db = new Database(server.dbPath, { readonly: true, fileMustExist: true });
    const player = db.prepare('SELECT id FROM players WHERE deleted_at IS NULL ORDER BY id LIMIT 1').get() as { id: string };
    db.close();
    await visit(`/players/${player.id}`, 'Player file');
    await visit('/sandbox', 'Flight sandbox');
    await visit('/planner', 'Set-piece planner');
    await signOut();
  }, 150_000);

  it('passes on Pitchside at phone size and logs a repetition with the keyboard alone', async () => {
    await page.setViewportSize({ width: 360, height: 740 });
    await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.assistant_coach);
    await audit('Home (assistant coach, phone)');
    await page.getByRole('button', { name: 'Account and settings' }).click();
    await page.getByRole('menu').waitFor();
    await audit('Account menu (phone)');
    await page.keyboard.press('Escape');

    await visit('/pitchside', 'Pitchside · session start', PITCHSIDE);
    await page.getByRole('radio', { name: 'U16', exact: true }).click();
    await page.getByRole('radio', { name: 'Headwind' }).click();
    await page.getByRole('radio', { name: 'Moderate' }).click();
    await page.getByRole('button', { name: 'Start session' }).click();
    await page.waitForURL(/\/pitchside\/[0-9a-f-]{36}$/);
    const sessionId = new URL(page.url()).pathname.split('/').at(-1) ?? '';
    await page.getByRole('button', { name: 'Use this drill' }).waitFor();
    await audit('Pitchside · drill', PITCHSIDE);
    await page.getByRole('button', { name: 'Use this drill' }).click();
    await page.getByTestId('player-chip').first().waitFor();
    await audit('Pitchside · logging', PITCHSIDE);

    // WCAG 2.2 SC 2.1.1 Keyboard: from the top of the page, Tab to a kicker, type a carry and
    // choose the outcome without a pointer.
    const status = page.getByTestId('log-status');
    const before = Number((await status.getAttribute('data-saved-count')) ?? '0');
    await page.evaluate(() => (document.activeElement instanceof HTMLElement ? document.activeElement.blur() : undefined));
    await tabTo(page, 'a player chip', () => focusedMatches(page, '[data-testid="player-chip"]'));
    await page.keyboard.press('Enter');
    // Enter selects the focused chip (the view updates on the next frame).
    await page.waitForFunction(() => document.activeElement?.getAttribute('aria-pressed') === 'true', null, { timeout: 5_000 });
    await tabTo(page, 'the carry field', () =>
      page.evaluate(() => {
        const focused = document.activeElement;
        return focused instanceof HTMLInputElement && (focused.labels?.[0]?.textContent ?? '').includes('Carry');
      }),
    );
    await page.keyboard.type('31');
    await tabTo(page, 'the Short outcome', () => page.evaluate(() => document.activeElement?.textContent?.trim() === 'Short'));
    await page.keyboard.press('Enter');
    await page.locator(`[data-testid="log-status"][data-saved-count="${before + 1}"]`).waitFor();
    await audit('Pitchside · logging (one saved)', PITCHSIDE);

    // Stored: the repetition reaches the server's database through the outbox.
    let stored: unknown;
    await until('the keyboard-logged repetition on the server', () => {
      const db = new Database(server.dbPath, { readonly: true, fileMustExist: true });
      try {
        stored = db.prepare('SELECT outcome, carry_m FROM kicks WHERE session_id = ?').get(sessionId);
      } finally {
        db.close();
      }
      return stored !== undefined;
    });
    expect(stored).toEqual({ outcome: 'short', carry_m: 31 });

    await page.getByTestId('sync-badge').click();
    await audit('Pitchside · sync panel', PITCHSIDE);
    await page.getByTestId('sync-badge').click();
    await page.getByRole('button', { name: 'Change' }).click();
    await audit('Pitchside · drill picker', PITCHSIDE);
    await page.getByRole('button', { name: 'Change' }).click();
    await page.getByText(/Entries/).click();
    await page.getByRole('list', { name: 'Repetitions this session' }).waitFor();
    await audit('Pitchside · entries', PITCHSIDE);
    await page.getByRole('button', { name: 'Account and settings' }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.setViewportSize({ width: 1280, height: 800 });
  }, 180_000);

  it('passes on the player and guardian screens', async () => {
    await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.player);
    await audit('Home (player)');
    await visit('/players/me', 'My file (player)');
    await visit('/sandbox', 'Flight sandbox (player)');
    await signOut();
    await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.guardian);
    await audit('Guardian home');
    await signOut();
  }, 120_000);
});
