/**
 * The club's units and locale in the browser: an administrator switches the demo club to yards and German
 * (Germany) in Club admin → Units and locale, and the head coach then reads yards with a decimal comma and
 * German dates on Pitchside, in Squad week and in a Player file, while a carry typed in yards is stored in
 * metres. Expected texts are computed here with `Intl` and the exact yard (0.9144 m, international yard and
 * pound agreement, 1959) from the server's own answers, not from the app's formatter.
 */
import Database from 'better-sqlite3';
import type { Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { launchContext } from './support/browser';
import { startE2eServer, type E2eServer } from './support/server';
import { signInThroughUi } from './support/sign-in';
import { until } from './support/waiting';

const LOCALE = 'de-DE';
const YARD_M = 0.9144;

/** A distance in metres as the club should read it: yards, one decimal, German decimal comma. */
function yards(valueM: number, digits = 1): string {
  return `${new Intl.NumberFormat(LOCALE, { minimumFractionDigits: digits, maximumFractionDigits: digits }).format(valueM / YARD_M)} yd`;
}

async function apiToken(baseUrl: string, email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: 'loftline-demo' }),
  });
  return ((await res.json()) as { accessToken: string }).accessToken;
}

async function apiGet<T>(baseUrl: string, token: string, path: string): Promise<T> {
  const res = await fetch(baseUrl + path, { headers: { Authorization: `Bearer ${token}` } });
  expect(res.status).withContext(path).toBe(200);
  return (await res.json()) as T;
}

/** Visible texts of the cells of one table column. */
async function cells(page: Page, table: string, column: string): Promise<string[]> {
  return (await page.locator(`${table} tbody td.mat-column-${column}`).allInnerTexts()).map((t) => t.trim());
}

describe('units and locale (end to end, Chromium)', () => {
  let server: E2eServer;

  beforeAll(async () => {
    server = await startE2eServer();
  }, 90_000);

  afterAll(async () => {
    await server?.stop();
    server?.cleanup();
  });

  it('lets an administrator switch the club to yards and German in Club admin', async () => {
    const { context, close } = await launchContext({ width: 1280, height: 900 });
    try {
      const page = await context.newPage();
      await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.admin);
      await page.goto(`${server.baseUrl}/admin/units`);
      await page.getByRole('heading', { name: 'Units and locale' }).waitFor();
      await page.getByRole('radio', { name: 'Yards' }).click();
      await page.getByRole('combobox', { name: 'Locale' }).click();
      await page.getByRole('option', { name: /\(de-DE\)/ }).click();
      // The preview reads the sample carry as it will be shown (31.4 m = 34.34 yd).
      await page.getByText(`a 31.4 m carry reads ${yards(31.4)}`).waitFor();
      await page.getByRole('button', { name: 'Save units and locale' }).click();
      await page.getByRole('status').filter({ hasText: 'Saved.' }).waitFor();
    } finally {
      await close();
    }
    const token = await apiToken(server.baseUrl, DEMO_ACCOUNTS.head_coach);
    const settings = await apiGet<{ distanceUnit: string; locale: string }>(server.baseUrl, token, '/api/club/settings');
    expect(settings.distanceUnit).toBe('yd');
    expect(settings.locale).toBe(LOCALE);
  }, 90_000);

  it('shows yards and German formatting on Pitchside, in Squad week and in a Player file', async () => {
    const token = await apiToken(server.baseUrl, DEMO_ACCOUNTS.head_coach);
    const { context, close } = await launchContext({ width: 1280, height: 900 });
    try {
      const page = await context.newPage();
      await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.head_coach);
      // A new device learns the club's locale from GET /api/club/settings after sign-in: wait for that answer.
      await page.waitForFunction((locale) => document.documentElement.lang === locale, LOCALE, { timeout: 15_000 });
      expect(await page.evaluate(() => document.documentElement.lang)).toBe(LOCALE);

      // Pitchside: the drill's target in yards, a carry typed in yards (decimal comma) stored in metres.
      await page.getByRole('link', { name: 'Pitchside' }).first().click();
      await page.getByRole('radio', { name: 'U16', exact: true }).click();
      await page.getByRole('button', { name: 'Start session' }).click();
      await page.waitForURL(/\/pitchside\/[0-9a-f-]{36}$/);
      const sessionId = new URL(page.url()).pathname.split('/').at(-1) ?? '';
      await page.getByRole('button', { name: 'Use this drill' }).click();
      const drill = await page.getByTestId('current-drill').innerText();
      expect(drill).toMatch(/→ \d+(,\d)? yd \(r \d+(,\d)? yd\)/);
      expect(drill).not.toMatch(/\d m\b/);
      const summary = await page.locator('.pitchside__summary').innerText();
      expect(summary)
        .withContext('24-hour clock')
        .toMatch(/\b\d{2}:\d{2}\b/);
      expect(summary).not.toMatch(/\b(AM|PM)\b/i);
      await page.getByTestId('player-chip').first().click();
      await page.getByLabel('Carry').fill('34,5');
      await page.getByRole('button', { name: 'On target', exact: true }).click();
      await page.locator('[data-testid="log-status"][data-saved-count="1"]').waitFor();
      const stored = (): { carry_m: number } | undefined => {
        const db = new Database(server.dbPath, { readonly: true, fileMustExist: true });
        try {
          return db.prepare('SELECT carry_m FROM kicks WHERE session_id = ?').get(sessionId) as { carry_m: number } | undefined;
        } finally {
          db.close();
        }
      };
      const badge = page.getByTestId('sync-badge');
      await until(
        'the kick to reach the server',
        async () => stored() !== undefined || /rejected|conflict/i.test(await badge.innerText()),
        60_000,
      ).catch(async (error: unknown) => {
        throw new Error(`${String(error)}; sync badge: ${await badge.innerText()}`);
      });
      expect(await badge.innerText()).not.toMatch(/rejected|conflict/i);
      expect(stored()!.carry_m).toBeCloseTo(34.5 * YARD_M, 6);

      // Squad week: median carries in yards with a decimal comma.
      await page.goto(`${server.baseUrl}/squad-week`);
      const table = 'll-squad-week-table table';
      await page.locator(`${table} tbody tr`).first().waitFor();
      const carries = (await cells(page, table, 'techCarry')).filter((t) => t !== '–');
      expect(carries.length).toBeGreaterThan(0);
      for (const text of carries) expect(text).toMatch(/^\d+,\d yd$/);

      // Player file: every carry and target in the recent-kicks table as the server's metres read in yards.
      await page.locator(`${table} tbody tr a`).first().click();
      await page.waitForURL(/\/players\/[0-9a-f-]{36}/);
      const playerId = new URL(page.url()).pathname.split('/').at(-1) ?? '';
      const recent = 'll-recent-kicks table';
      await page.locator(`${recent} tbody tr`).first().waitFor();
      const { kicks } = await apiGet<{ kicks: { carryM: number | null; targetDistanceM: number; recordedAt: string }[] }>(
        server.baseUrl,
        token,
        `/api/players/${playerId}/kicks`,
      );
      const expectedCarries = new Set(kicks.filter((k) => k.carryM !== null).map((k) => yards(k.carryM!)));
      const shownCarries = (await cells(page, recent, 'carry')).filter((t) => t !== '–');
      expect(shownCarries.length).toBeGreaterThan(0);
      for (const text of shownCarries) expect(expectedCarries.has(text)).withContext(`${text} is one of the player's carries`).toBeTrue();
      for (const text of await cells(page, recent, 'target')) expect(text).toMatch(/^\d+(,\d)? yd · r \d+(,\d)? yd$/);
      // German weekday abbreviations and a 24-hour clock, e.g. "Di., 3. März, 18:30".
      const when = await cells(page, recent, 'recordedAt');
      const weekdays = new Set(kicks.map((k) => new Intl.DateTimeFormat(LOCALE, { weekday: 'short' }).format(new Date(k.recordedAt))));
      for (const text of when) {
        expect([...weekdays].some((w) => text.startsWith(w)))
          .withContext(text)
          .toBeTrue();
        expect(text).toMatch(/\d{2}:\d{2}$/);
      }
    } finally {
      await close();
    }
  }, 180_000);
});
