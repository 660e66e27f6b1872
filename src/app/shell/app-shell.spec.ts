import { BreakpointObserver, BreakpointState } from '@angular/cdk/layout';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatNavListHarness } from '@angular/material/list/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { MatToolbarHarness } from '@angular/material/toolbar/testing';
import { Router, provideRouter } from '@angular/router';
import { of } from 'rxjs';
import type { SessionUser } from '../../../shared/schemas/auth';
import { AuthSession, SESSION_STORAGE_KEY } from '../core/auth/auth-session';
import { BROWSER_STORAGE, MemoryStorage } from '../core/browser-storage';
import { LOFTLINE_DB, type LoftlineDb } from '../core/loftline-db';
import { NAV_ITEMS, navItemsFor } from '../core/nav-items';
import { freshDb, until } from '../core/spec-support';
import { SyncQueue } from '../core/sync/sync-queue';
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

/** Puts `count` unsent kick mutations of the coach into the outbox. */
async function seedOutbox(db: LoftlineDb, count: number): Promise<void> {
  for (let i = 0; i < count; i++) {
    await db.outbox.add({
      id: `6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f20${String(i).padStart(2, '0')}`,
      seq: i + 1,
      userId: coach.id,
      entity: 'kick',
      entityId: `6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f21${String(i).padStart(2, '0')}`,
      sessionId: '6a0c1c3e-5a7e-4c44-9a8e-0d7e0c6f2200',
      op: 'upsert',
      data: {},
      queuedAt: '2026-11-20T18:00:00.000Z',
      state: 'pending',
      revision: 0,
      attempts: 0,
    });
  }
}

describe('AppShell', () => {
  let fixture: ComponentFixture<AppShell>;
  let loader: HarnessLoader;
  let backend: HttpTestingController;
  let storage: MemoryStorage;
  let db: LoftlineDb;

  /** The sync queue starts with the shell and pulls once; answer it with no changes. */
  async function answerPull(): Promise<void> {
    await until('the first pull', () => {
      const pulls = backend.match((r) => r.url === '/api/sync/pull');
      pulls.forEach((r) => r.flush({ changes: [], cursor: 0, hasMore: false }));
      return pulls.length > 0;
    });
  }

  /** Opens the shell; `before` seeds the database (and then the spec answers the queue itself). */
  async function open(wide: boolean, before?: (db: LoftlineDb) => Promise<void>): Promise<void> {
    db = freshDb();
    await before?.(db);
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
        { provide: LOFTLINE_DB, useValue: db },
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
    if (!before) {
      await answerPull();
    }
    await fixture.whenStable();
  }

  afterEach(async () => {
    backend.verify();
    document.documentElement.removeAttribute('data-theme');
    TestBed.resetTestingModule();
    await db.delete();
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
    const titles = await Promise.all(items.map((item) => item.getTitle()));
    expect(titles).toEqual(navItemsFor('head_coach', NAV_ITEMS).map((item) => item.label));
    expect(titles).toContain('Pitchside');
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

  it('warns before signing out with unsynced changes, and keeps them when the coach signs out anyway', async () => {
    await open(true, (d) => seedOutbox(d, 2));
    const queue = TestBed.inject(SyncQueue);
    // The queue tries to send them; no signal.
    await until('the push', () => {
      const pushes = backend.match('/api/sync/push');
      pushes.forEach((r) => r.error(new ProgressEvent('error')));
      return pushes.length > 0;
    });
    await until('the count', () => queue.unsynced() === 2);

    await (await loader.getHarness(MatButtonHarness.with({ text: /Sign out/ }))).click();
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
    const dialog = await root.getHarness(MatDialogHarness);
    expect(await dialog.getText()).toContain('2 changes are saved on this phone but not on the server');
    await (await root.getHarness(MatButtonHarness.with({ text: 'Sign out, keep them' }))).click();
    await until('the sign-out call', () => {
      const calls = backend.match('/api/auth/logout');
      calls.forEach((r) => r.flush(null, { status: 204, statusText: 'No Content' }));
      return calls.length > 0;
    });
    await fixture.whenStable();

    expect(TestBed.inject(AuthSession).isSignedIn()).toBeFalse();
    expect(await db.outbox.count()).toBe(2);
  });

  it('stays signed in when the coach chooses to, and tries to sync again', async () => {
    await open(true, (d) => seedOutbox(d, 1));
    await until('the push', () => {
      const pushes = backend.match('/api/sync/push');
      pushes.forEach((r) => r.error(new ProgressEvent('error')));
      return pushes.length > 0;
    });
    await until('the count', () => TestBed.inject(SyncQueue).unsynced() === 1);
    await until('the bar mark', () => ((fixture.nativeElement as HTMLElement).textContent ?? '').includes('cloud_upload'));

    await (await loader.getHarness(MatButtonHarness.with({ text: /Sign out/ }))).click();
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
    await (await root.getHarness(MatButtonHarness.with({ text: 'Stay signed in' }))).click();
    await until('another push', () => {
      const pushes = backend.match('/api/sync/push');
      pushes.forEach((r) => r.error(new ProgressEvent('error')));
      return pushes.length > 0;
    });

    expect(TestBed.inject(AuthSession).isSignedIn()).toBeTrue();
    backend.expectNone('/api/auth/logout');
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
