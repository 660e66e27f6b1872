import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { requireSignedIn, requireSignedOut, safeReturnUrl } from './auth-guard';
import { SESSION_STORAGE_KEY } from './auth-session';
import { BROWSER_STORAGE, MemoryStorage } from '../browser-storage';

@Component({ template: '' })
class Blank {}

describe('auth guards', () => {
  let storage: MemoryStorage;

  function setUp(): Router {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: storage },
        provideRouter([
          { path: 'sign-in', component: Blank, canMatch: [requireSignedOut] },
          { path: 'home', component: Blank, canActivate: [requireSignedIn] },
          { path: 'squads/:id', component: Blank, canActivate: [requireSignedIn] },
        ]),
      ],
    });
    return TestBed.inject(Router);
  }

  beforeEach(() => {
    storage = new MemoryStorage();
  });

  it('sends a signed-out user to sign-in, remembering the page asked for', async () => {
    const router = setUp();
    await router.navigateByUrl('/squads/u16?tab=week');
    expect(router.url).toBe('/sign-in?returnUrl=%2Fsquads%2Fu16%3Ftab%3Dweek');
  });

  it('lets a signed-in user through and keeps them off the sign-in page', async () => {
    storage.setItem(
      SESSION_STORAGE_KEY,
      JSON.stringify({
        accessToken: 'a',
        refreshToken: 'refresh-token-number-1',
        user: { id: 'u', email: 'e@x.org', displayName: 'E', role: 'admin', clubId: 'c' },
        club: null,
      }),
    );
    const router = setUp();
    await router.navigateByUrl('/squads/u16');
    expect(router.url).toBe('/squads/u16');
    await router.navigateByUrl('/sign-in');
    expect(router.url).toBe('/home');
  });

  it('only returns to local paths after sign-in', () => {
    expect(safeReturnUrl('/squads/u16?tab=week')).toBe('/squads/u16?tab=week');
    expect(safeReturnUrl(undefined)).toBe('/home');
    expect(safeReturnUrl('')).toBe('/home');
    expect(safeReturnUrl('https://evil.example/')).toBe('/home');
    expect(safeReturnUrl('//evil.example/')).toBe('/home');
    expect(safeReturnUrl('/\\evil.example/')).toBe('/home');
    expect(safeReturnUrl('/sign-in?returnUrl=%2Fhome')).toBe('/home');
  });
});
