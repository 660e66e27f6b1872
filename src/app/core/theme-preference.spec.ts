import { DOCUMENT } from '@angular/common';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { BROWSER_STORAGE, MemoryStorage } from './browser-storage';
import { THEME_STORAGE_KEY, ThemePreference } from './theme-preference';

describe('ThemePreference', () => {
  let storage: MemoryStorage;
  let root: HTMLElement;

  function setUp(): ThemePreference {
    TestBed.configureTestingModule({
      providers: [provideZonelessChangeDetection(), { provide: BROWSER_STORAGE, useValue: storage }],
    });
    root = TestBed.inject(DOCUMENT).documentElement;
    return TestBed.inject(ThemePreference);
  }

  beforeEach(() => {
    storage = new MemoryStorage();
  });

  afterEach(() => root.removeAttribute('data-theme'));

  it('follows the device until the user picks a theme', () => {
    const theme = setUp();
    expect(theme.mode()).toBe('system');
    expect(root.hasAttribute('data-theme')).toBeFalse();
    expect(theme.isDark()).toBe(matchMedia('(prefers-color-scheme: dark)').matches);
  });

  it('toggles to the other theme, applies it and remembers it', () => {
    const theme = setUp();
    const wasDark = theme.isDark();
    theme.toggle();
    expect(theme.isDark()).toBe(!wasDark);
    expect(root.getAttribute('data-theme')).toBe(wasDark ? 'light' : 'dark');
    expect(storage.getItem(THEME_STORAGE_KEY)).toBe(wasDark ? 'light' : 'dark');
  });

  it('starts with the remembered theme and can go back to the device setting', () => {
    storage.setItem(THEME_STORAGE_KEY, 'dark');
    const theme = setUp();
    expect(theme.isDark()).toBeTrue();
    expect(root.getAttribute('data-theme')).toBe('dark');
    theme.setMode('system');
    expect(storage.getItem(THEME_STORAGE_KEY)).toBeNull();
    expect(root.hasAttribute('data-theme')).toBeFalse();
  });
});
