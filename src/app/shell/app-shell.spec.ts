import { BreakpointObserver, BreakpointState } from '@angular/cdk/layout';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatNavListHarness } from '@angular/material/list/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatToolbarHarness } from '@angular/material/toolbar/testing';
import { Router, provideRouter } from '@angular/router';
import { of } from 'rxjs';
import type { SessionUser } from '../../../shared/schemas/auth';
import { AuthSession, SESSION_STORAGE_KEY } from '../core/auth-session';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { THEME_STORAGE_KEY } from '../core/theme-preference';
import { AppShell } from './app-shell';

@Component({ template: '' })
class Blank {}

const coach: SessionUser = {
  id: 'user-coach',
  email: 'coach@example.org',
  displayName: 'Robin Coach',
  role: 'head_coach',
  clubId: 'club-1',
};

/** A BreakpointObserver that reports a fixed screen width, whatever the test browser's window is. */
function fixedWidth(wide: boolean): Partial<BreakpointObserver> {
  const state: BreakpointState = { matches: wide, breakpoints: {} };
  return { observe: () => of(state), isMatched: () => wide };
}

describe('AppShell', () => {
  let fixture: ComponentFixture<AppShell>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;
  let storage: MemoryStorage;

  async function open(wide: boolean): Promise<void> {
    storage = new MemoryStorage();
    storage.setItem(
      SESSION_STORAGE_KEY,
      JSON.stringify({
        accessToken: 'access-1',
        refreshToken: 'refresh-token-number-1',
        user: coach,
        club: { id: 'club-1', name: 'Harbour Academy' },
      }),
    );
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([
          { path: 'home', component: Blank },
          { path: 'sign-in', component: Blank },
        ]),
        { provide: BROWSER_STORAGE, useValue: storage },
        { provide: BreakpointObserver, useValue: fixedWidth(wide) },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AppShell);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    backend.expectOne('/api/me').flush({
      user: coach,
      club: { id: 'club-1', name: 'Harbour Academy' },
      playerId: null,
      childPlayerIds: [],
    });
    await fixture.whenStable();
  }

  afterEach(() => {
    backend.verify();
    document.documentElement.removeAttribute('data-theme');
  });

  it('shows product, club, user and role in the bar on a wide screen', async () => {
    await open(true);
    const bar = await loader.getHarness(MatToolbarHarness);
    const text = await bar.getRowsAsText();
    expect(text.join(' ')).toContain('Loftline');
    expect(text.join(' ')).toContain('Harbour Academy');
    expect(text.join(' ')).toContain('Robin Coach');
    expect(text.join(' ')).toContain('Head coach');
  });

  it('lists the navigation for the role in the side nav', async () => {
    await open(true);
    const nav = await loader.getHarness(MatNavListHarness);
    const items = await nav.getItems();
    expect(await Promise.all(items.map((item) => item.getTitle()))).toEqual(['Home']);
    expect(await items[0]?.getHref()).toBe('/home');
  });

  it('signs out from the bar and goes to the sign-in page', async () => {
    await open(true);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Sign out/ }))).click();
    backend.expectOne('/api/auth/logout').flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();

    expect(TestBed.inject(AuthSession).isSignedIn()).toBeFalse();
    expect(TestBed.inject(Router).url).toBe('/sign-in');
  });

  it('toggles the theme and remembers the choice', async () => {
    await open(true);
    const toggle = await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label^="Switch to"]' }));
    await toggle.click();
    const chosen = storage.getItem(THEME_STORAGE_KEY);
    expect(chosen === 'light' || chosen === 'dark').toBeTrue();
    expect(document.documentElement.getAttribute('data-theme')).toBe(chosen);
  });

  it('folds account controls into one menu on a phone', async () => {
    await open(false);
    const bar = await loader.getHarness(MatToolbarHarness);
    expect((await bar.getRowsAsText()).join(' ')).not.toContain('Robin Coach');

    const menu = await loader.getHarness(MatMenuHarness.with({ triggerText: 'account_circle' }));
    await menu.open();
    const labels = await Promise.all((await menu.getItems()).map((item) => item.getText()));
    expect(labels.some((label) => label.includes('Sign out'))).toBeTrue();
    expect(labels.some((label) => label.includes('theme'))).toBeTrue();
    await menu.close();
  });
});
