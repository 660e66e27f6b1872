import { signInThroughUi } from './support/sign-in';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { Page } from 'playwright-core';
import { launchContext } from './support/browser';
import { type E2eServer, useE2eServer } from './support/server';

const FIXTURES = resolve('spec/e2e/fixtures');

const signIn = signInThroughUi;

async function choose(page: Page, combobox: string, option: string): Promise<void> {
  await page.getByRole('combobox', { name: combobox }).click();
  await page.getByRole('option', { name: option, exact: true }).click();
}

/** Fills the drill for U16 lofted passes at 30 m and chooses `file`. */
async function drillAndFile(page: Page, file: string): Promise<void> {
  await choose(page, 'Squad', 'U16');
  await page.getByLabel('Target distance (m)').fill('30');
  await page.getByLabel('Choose the device CSV').setInputFiles(resolve(FIXTURES, file));
}

describe('imports and exports (end to end, Chromium)', () => {
  let server: E2eServer;
  useE2eServer((started) => (server = started));

  it('imports a device file: columns proposed, unmatched players shown, saved columns reused, committed once', async () => {
    const { context, close } = await launchContext();
    try {
      const page = await context.newPage();
      await signIn(page, server.baseUrl, 'head.coach@kestrel-vale.test');
      await page.getByRole('link', { name: 'Imports and exports' }).first().click();
      await page.waitForURL(/\/imports\/kicks$/);

      await drillAndFile(page, 'measured-kicks-with-problems.csv');
      await page.getByText('6 rows and 8 columns read on this device.').waitFor();
      await page.getByRole('button', { name: /Next: columns/ }).click();
      expect(await page.getByRole('combobox', { name: 'Player (required)' }).innerText()).toContain('Kicker');
      expect(await page.getByRole('combobox', { name: 'Ball speed' }).innerText()).toContain('Ball speed (mph)');
      await page.getByLabel('Device name').fill('Pitch radar A');
      await page.keyboard.press('Escape');
      await page.getByRole('button', { name: /Check the rows/ }).click();

      await page.getByText('Players not found in this squad').waitFor();
      const body = await page.locator('main, body').first().innerText();
      expect(body).toContain('“42” · 1 row');
      expect(body).toContain('“Nobody Here” · 1 row');
      expect(body).toMatch(/3 problems in 3 of 6 rows/);
      // Rows 4 and 6 name nobody in U16; row 7's speed is not a number.
      const highlighted = page.locator('tr.preview__row--problem td.preview__rownum');
      expect(await highlighted.allInnerTexts()).toEqual(['4', '6', '7']);
      expect(await page.locator('td.preview__cell--bad').allInnerTexts()).toEqual(['42', 'Nobody Here', 'not measured']);
      expect(await page.getByRole('button', { name: /Import \d+ kicks?/ }).isDisabled()).toBeTrue();

      await page.getByRole('button', { name: /Back to the columns/ }).click();
      await page.getByRole('button', { name: 'Back', exact: true }).click();
      await page.getByLabel('Choose the device CSV').setInputFiles(join(FIXTURES, 'measured-kicks.csv'));
      await page.getByText('Its columns match those saved for Pitch radar A.').waitFor();
      await page.getByRole('button', { name: /Next: columns/ }).click();
      expect(await page.getByLabel('Device name').inputValue()).toBe('Pitch radar A');
      await page.getByRole('button', { name: /Check the rows/ }).click();
      await page.getByText('All 6 rows can be imported: 6 new kicks.').waitFor();
      await page.getByRole('button', { name: /Import 6 kicks/ }).click();
      await page.getByText('6 kicks imported into a new session.').waitFor();

      // The same file again adds nothing.
      await page.getByRole('button', { name: 'Import another file' }).click();
      await page.getByLabel('Choose the device CSV').setInputFiles(join(FIXTURES, 'measured-kicks.csv'));
      await page.getByRole('button', { name: /Next: columns/ }).click();
      await page.getByRole('button', { name: /Check the rows/ }).click();
      await page.getByText('This file has been imported before with these columns, so there is nothing to import.').waitFor();

      // The kicks are in the export of that day, with the players' names and metric values.
      await page.getByRole('tab', { name: 'Kick exports' }).click();
      await choose(page, 'Squad', 'U16');
      await page.getByLabel('From', { exact: true }).fill('2026-11-30');
      await page.getByLabel('To', { exact: true }).fill('2026-11-30');
      const [download] = await Promise.all([
        page.waitForEvent('download'),
        page.getByRole('button', { name: /Download kicks CSV/ }).click(),
      ]);
      expect(download.suggestedFilename()).toBe('loftline-kicks-2026-11-30-2026-11-30.csv');
      const csv = readFileSync(await download.path(), 'utf8');
      // The server reads the device's local times as the test process does (same machine).
      const recordedAt = new Date('2026-11-30T18:15:10').toISOString();
      const imported = csv.split('\r\n').filter((line) => line.includes('Amara Nwosu-Pike') && line.includes(recordedAt));
      expect(imported.length).toBe(1);
      // 58.1 mph = 25.97 m/s; 33.5 yd = 30.63 m (exact yard and mile definitions, 1959 agreement).
      expect(imported[0]).toMatch(/,30\.63,/);
      expect(imported[0]).toMatch(/,25\.97/);
      await page.getByText(/Saved loftline-kicks-2026-11-30-2026-11-30\.csv: \d+ kicks/).waitFor();
    } finally {
      await close();
    }
  }, 120_000);

  it('shows how far a large upload has got on a slow connection', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'loftline-e2e-upload-'));
    const { context, close } = await launchContext();
    try {
      const names = ['Amara Nwosu-Pike', 'Yusuf Demirel', 'Theo Castellane', 'Priya Raghunathan'];
      const lines = ['Kicker,Ball speed (m/s),Carry (m)'];
      for (let i = 0; i < 40_000; i++)
        lines.push(`${names[i % names.length]},${(20 + (i % 90) / 10).toFixed(1)},${(25 + (i % 70) / 10).toFixed(1)}`);
      const big = join(dir, 'long-session.csv');
      writeFileSync(big, lines.join('\r\n') + '\r\n');

      const page = await context.newPage();
      await signIn(page, server.baseUrl, 'head.coach@kestrel-vale.test');
      await page.goto(server.baseUrl + '/imports/kicks');
      await drillAndFile(page, big);
      await page.getByText('40000 rows and 3 columns read on this device.').waitFor();
      await page.getByRole('button', { name: /Next: columns/ }).click();

      const cdp = await context.newCDPSession(page);
      await cdp.send('Network.enable');
      await cdp.send('Network.emulateNetworkConditions', {
        offline: false,
        latency: 20,
        downloadThroughput: -1,
        uploadThroughput: 128 * 1024,
      });
      await page.getByRole('button', { name: /Check the rows/ }).click();
      const sending = page.getByText(/Sending long-session\.csv: .* of .* \((\d+) %\)/);
      await sending.waitFor();
      const bar = page.getByRole('progressbar', { name: /Sending long-session\.csv/ });
      await page.waitForFunction(() => {
        const el = document.querySelector('ll-upload-progress [role=progressbar]');
        const now = Number(el?.getAttribute('aria-valuenow') ?? '0');
        return now > 0 && now < 100;
      });
      const midway = Number(await bar.getAttribute('aria-valuenow'));
      expect(midway).toBeGreaterThan(0);
      expect(midway).toBeLessThan(100);
      await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
      await page.getByText('All 40000 rows can be imported: 40000 new kicks.').waitFor({ timeout: 60_000 });
    } finally {
      await close();
      rmSync(dir, { recursive: true, force: true });
    }
  }, 150_000);

  it('lets an administrator fix a roster on a phone: refused rows highlighted, then a clean commit', async () => {
    const { context, close } = await launchContext({ width: 360, height: 740 });
    try {
      const page = await context.newPage();
      await signIn(page, server.baseUrl, 'admin@kestrel-vale.test');
      await page.goto(server.baseUrl + '/imports/roster');
      await page.getByLabel('Choose the roster CSV').setInputFiles(join(FIXTURES, 'roster-with-problems.csv'));
      await page.getByText(/4 problems in 2 of 3 rows/).waitFor();
      expect(await page.locator('tr.preview__row--problem td.preview__rownum').allInnerTexts()).toEqual(['3', '4']);
      const problems = await page.locator('tr.preview__row--problem td.preview__problems').allInnerTexts();
      expect(problems[0]).toContain('shirt_number: Shirt number must be a whole number from 1 to 99');
      expect(problems[1]).toContain('foot: Foot must be left or right');
      expect(problems[1]).toContain('"not-an-email" is not a valid e-mail address');
      expect(await page.getByRole('button', { name: /Import 3 rows/ }).isDisabled()).toBeTrue();

      await page.getByRole('button', { name: /Choose another file/ }).click();
      await page.getByLabel('Choose the roster CSV').setInputFiles(join(FIXTURES, 'roster.csv'));
      await page.getByText('All 3 rows can be imported.').waitFor();
      await page.getByRole('button', { name: /Import 3 rows/ }).click();
      await page.getByText('Roster imported').waitFor();
      const summary = await page.getByRole('list', { name: 'What the import did' }).innerText();
      expect(summary).toContain('1 squad created');
      expect(summary).toContain('3 players added');
      expect(summary).toContain('3 guardian accounts created');

      await page.goto(server.baseUrl + '/imports/exports');
      await page.getByRole('combobox', { name: 'Squad' }).click();
      await page.getByRole('option', { name: 'U12', exact: true }).waitFor();
    } finally {
      await close();
    }
  }, 120_000);

  it('gives an administrator a player’s data, then erases the player only once the name is typed', async () => {
    const { context, close } = await launchContext();
    try {
      const page = await context.newPage();
      await signIn(page, server.baseUrl, 'admin@kestrel-vale.test');
      await page.goto(server.baseUrl + '/imports/data-requests');
      await choose(page, 'Squad', 'First team');
      await page.getByRole('combobox', { name: 'Player' }).click();
      await page.getByRole('option', { name: /Gareth Pellow$/ }).click();

      const [download] = await Promise.all([
        page.waitForEvent('download'),
        page.getByRole('button', { name: /Download Gareth Pellow’s data/ }).click(),
      ]);
      const data = JSON.parse(readFileSync(await download.path(), 'utf8')) as { player: { displayName: string }; kicks: unknown[] };
      expect(data.player.displayName).toBe('Gareth Pellow');
      expect(data.kicks.length).toBeGreaterThan(0);

      const erase = page.getByRole('button', { name: /Erase Gareth Pellow for good/ });
      await page.getByText('Remove the kicks', { exact: true }).click();
      await page.getByLabel('Type the player’s name to confirm').fill('gareth pellow');
      expect(await erase.isDisabled()).toBeTrue();
      await page.getByLabel('Type the player’s name to confirm').fill('Gareth Pellow');
      await erase.click();
      await page.getByText(`Gareth Pellow has been erased: ${data.kicks.length} kicks removed. The erasure is in the audit log.`).waitFor();

      await page.getByRole('combobox', { name: 'Player' }).click();
      await page.getByRole('option').first().waitFor();
      expect(await page.getByRole('option', { name: /Gareth Pellow/ }).count()).toBe(0);
    } finally {
      await close();
    }
  }, 120_000);
});
