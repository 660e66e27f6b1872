import { signInThroughUi } from './support/sign-in';
import { launchContext } from './support/browser';
import { type E2eServer, useE2eServer } from './support/server';

const signIn = signInThroughUi;

describe('signing in (end to end, Chromium)', () => {
  let server: E2eServer;
  useE2eServer((started) => (server = started));

  it('shows the head coach the three squads', async () => {
    const { context, close } = await launchContext();
    try {
      const page = await context.newPage();
      await signIn(page, server.baseUrl, 'head.coach@kestrel-vale.test');
      const squads = page.getByRole('region', { name: 'Your squads' }).getByRole('listitem');
      await squads.first().waitFor();
      expect(await squads.count()).toBe(3);
      const text = (await squads.allInnerTexts()).join('\n');
      expect(text).toContain('U14');
      expect(text).toContain('U16');
      expect(text).toMatch(/first team/i);
    } finally {
      await close();
    }
  }, 60_000);

  it('shows the player only themselves', async () => {
    const { context, close } = await launchContext({ width: 360, height: 740 });
    try {
      const page = await context.newPage();
      await signIn(page, server.baseUrl, 'player@kestrel-vale.test');
      const own = page.getByRole('region', { name: 'Your player entry' }).getByRole('listitem');
      await own.first().waitFor();
      expect(await own.count()).toBe(1);
      expect(await page.getByRole('region', { name: 'Your squads' }).count()).toBe(0);
      expect(await own.first().innerText()).toContain('U16');
    } finally {
      await close();
    }
  }, 60_000);

  it('shows a readable error for a wrong password and stays on the sign-in page', async () => {
    const { context, close } = await launchContext();
    try {
      const page = await context.newPage();
      await page.goto(server.baseUrl + '/sign-in');
      await page.getByLabel('E-mail', { exact: true }).fill('head.coach@kestrel-vale.test');
      await page.getByLabel('Password', { exact: true }).fill('wrong-password');
      await page.getByRole('button', { name: /sign in/i }).click();
      await page.getByText('E-mail or password is wrong').waitFor();
      expect(new URL(page.url()).pathname).toBe('/sign-in');
    } finally {
      await close();
    }
  }, 60_000);

  it('serves the fonts and icon font from our own origin', async () => {
    const { context, close } = await launchContext();
    try {
      const page = await context.newPage();
      const external: string[] = [];
      page.on('request', (r) => {
        if (!r.url().startsWith(server.baseUrl) && !r.url().startsWith('data:')) external.push(r.url());
      });
      await page.goto(server.baseUrl + '/sign-in');
      await page.getByLabel('E-mail', { exact: true }).waitFor();
      const fontsOk = await page.evaluate(async () => {
        await document.fonts.ready;
        return {
          text: document.fonts.check('16px "Atkinson Hyperlegible"'),
          icons: document.fonts.check('24px "Loftline Symbols"'),
          // The password toggle: a ligature the cut-down font holds draws one 24 px glyph, not the word "visibility".
          iconWidthPx: document.querySelector('button mat-icon')?.getBoundingClientRect().width ?? 0,
        };
      });
      expect(fontsOk.text).toBeTrue();
      expect(fontsOk.icons).toBeTrue();
      expect(fontsOk.iconWidthPx).toBeGreaterThan(0);
      expect(fontsOk.iconWidthPx).toBeLessThanOrEqual(28);
      expect(external).toEqual([]);
    } finally {
      await close();
    }
  }, 60_000);
});
