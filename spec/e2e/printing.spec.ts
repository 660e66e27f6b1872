/**
 * Printing to PDF for the staff meeting: Squad week, a Player file and the Set-piece planner through
 * Chromium's own PDF printer (`page.pdf`, the print stylesheet's `@page` size). The PDF gives the page
 * size and count; what the sheet says is read from the page under print media (`emulateMedia`), where
 * the browser's `innerText` leaves out everything the print stylesheet hides.
 */
import type { Page } from 'playwright-core';
import { DEMO_ACCOUNTS } from '../../seed/scenario';
import { launchContext } from './support/browser';
import { startE2eServer, type E2eServer } from './support/server';
import { signInThroughUi } from './support/sign-in';

/** ISO 216 A4 is 210 × 297 mm; PDF user space is 1/72 inch, so 595.28 × 841.89 pt. */
const A4_PT = { width: (210 / 25.4) * 72, height: (297 / 25.4) * 72 };

/** Pages of a PDF and their media boxes, read from the file's page objects (ISO 32000-1, 7.7.3.3). */
function pdfPages(pdf: Buffer): { width: number; height: number }[] {
  const text = pdf.toString('latin1');
  const boxes = [...text.matchAll(/\/Type\s*\/Page\b[\s\S]*?\/MediaBox\s*\[\s*([\d.-]+)\s+([\d.-]+)\s+([\d.-]+)\s+([\d.-]+)\s*\]/g)];
  return boxes.map((m) => ({ width: Number(m[3]) - Number(m[1]), height: Number(m[4]) - Number(m[2]) }));
}

/** Prints the page to PDF and checks every page is A4 portrait; returns the page count. */
async function printA4(page: Page): Promise<number> {
  const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
  expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  const pages = pdfPages(pdf);
  // The root of the page tree counts every page (the tree may nest; ISO 32000-1, 7.7.3.2).
  const counts = [...pdf.toString('latin1').matchAll(/\/Type\s*\/Pages\b[^>]*?\/Count\s+(\d+)/g)].map((m) => Number(m[1]));
  const declared = Math.max(...counts);
  expect(pages.length).withContext('page objects match the page tree count').toBe(declared);
  for (const size of pages) {
    expect(size.width).toBeCloseTo(A4_PT.width, 0);
    expect(size.height).toBeCloseTo(A4_PT.height, 0);
  }
  return pages.length;
}

/** Under print media: the text a printed sheet shows, and whether the app's navigation is hidden. */
async function printedView(page: Page): Promise<{ text: string; chromeShown: string[] }> {
  await page.emulateMedia({ media: 'print' });
  try {
    return await page.evaluate(() => {
      const chrome = ['.shell__bar', '.shell__sidenav', '.shell__bottom-nav', 'nav', 'button:not(.ll-print-text)'];
      const chromeShown = chrome.filter((selector) =>
        Array.from(document.querySelectorAll(selector)).some((el) => el.getClientRects().length > 0),
      );
      return { text: document.body.innerText, chromeShown };
    });
  } finally {
    // Back to no emulation (not "screen": page.pdf() would then print the screen layout).
    await page.emulateMedia({ media: null });
  }
}

describe('printing to PDF (end to end, Chromium)', () => {
  let server: E2eServer;
  let page: Page;
  let close: () => Promise<void>;

  beforeAll(async () => {
    server = await startE2eServer();
    const browser = await launchContext({ width: 1280, height: 900 });
    close = browser.close;
    page = await browser.context.newPage();
    await signInThroughUi(page, server.baseUrl, DEMO_ACCOUNTS.head_coach);
  }, 120_000);

  afterAll(async () => {
    await close?.();
    await server?.stop();
    server?.cleanup();
  });

  it('prints Squad week on A4 with the table, the charts and then one page per player', async () => {
    await page.getByRole('link', { name: 'Squad week' }).first().click();
    await page.waitForURL(/\/squad-week/);
    await page.locator('ll-squad-week-table tbody tr').first().waitFor({ timeout: 60_000 });
    const names = (await page.locator('ll-squad-week-table tbody td.mat-column-player').allInnerTexts()).map((t) => t.trim());
    const sheets = await page.locator('ll-player-sheets .player-sheet').count();
    expect(sheets).toBeGreaterThan(3);
    expect(await page.locator('ll-player-sheets').isVisible())
      .withContext('player pages are for paper only')
      .toBeFalse();

    const printed = await printedView(page);
    expect(printed.chromeShown).toEqual([]);
    expect(printed.text).toContain('Squad week');
    expect(printed.text).toMatch(/Week of \d+ \w+ \d{4}/);
    for (const name of names) expect(printed.text).toContain(name);
    expect(printed.text).not.toContain('Send digests now');

    // Table and charts, then each player's page: a missing page break would fit several players on one page.
    expect(await printA4(page)).toBeGreaterThanOrEqual(sheets + 2);
  }, 120_000);

  it('prints a Player file on A4 with its reach and recent kicks and no navigation', async () => {
    await page.locator('ll-squad-week-table tbody tr a').first().click();
    await page.waitForURL(/\/players\/[0-9a-f-]{36}/);
    await page.locator('ll-recent-kicks tbody tr').first().waitFor({ timeout: 60_000 });
    const name = (await page.getByRole('heading', { level: 1 }).innerText()).trim();
    const firstCarry = (await page.locator('ll-recent-kicks tbody td.mat-column-carry').first().innerText()).trim();

    const printed = await printedView(page);
    expect(printed.chromeShown).toEqual([]);
    expect(printed.text).toContain(name);
    expect(printed.text).toContain(firstCarry);
    expect(await printA4(page)).toBeGreaterThanOrEqual(1);
  }, 90_000);

  it('prints the Set-piece planner’s spot, ranking and chosen kick on A4', async () => {
    // The server fits profiles in the background after start-up; the planner ranks whoever has one and asks again.
    await page.goto(server.baseUrl + '/planner');
    await page.locator('table').getByRole('button').first().waitFor({ timeout: 240_000 });
    await page.locator('g.ll-goal-mouth__cloud path').first().waitFor({ timeout: 60_000 });
    const ranked = (await page.locator('table tbody tr').first().innerText()).split(/\s+/).filter(Boolean);
    const spot = (await page.locator('.planner__spot').innerText()).trim();

    const printed = await printedView(page);
    expect(printed.chromeShown).toEqual([]);
    expect(printed.text).toContain(spot);
    expect(printed.text).toContain('Who takes it');
    expect(printed.text).toMatch(/free kick/);
    // The top-ranked player's name and share are on the sheet (the name prints as text, not as a button).
    for (const word of ranked.slice(1, 3)) expect(printed.text).toContain(word);
    expect(printed.text).toContain('Chosen kick from the side');
    // The spot and the ranking, then the chosen kick on a page of its own.
    const pages = await printA4(page);
    expect(pages).toBeGreaterThanOrEqual(2);
    expect(pages).toBeLessThanOrEqual(3);
  }, 360_000);
});
