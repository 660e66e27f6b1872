import { DOCUMENT } from '@angular/common';
import { DestroyRef, Injectable, computed, inject, signal } from '@angular/core';
import { BROWSER_STORAGE } from './browser-storage';

/** Which theme the user wants: the device's setting, or one they picked. */
export type ThemeMode = 'system' | 'light' | 'dark';

/** The localStorage key of the user's theme choice. */
export const THEME_STORAGE_KEY = 'loftline.theme';

/** Colour of the browser and OS chrome around the app, per effective theme. */
const CHROME_COLOURS = { light: '#1B2A41', dark: '#0C1C32' } as const;

/**
 * Light or dark, remembered on the device. Follows `prefers-color-scheme` until the user
 * toggles, because evening sessions under floodlights want the dark theme while the phone
 * itself may be set to light. The theme is applied by setting `color-scheme` on `<html>`
 * (through `data-theme`), which the Material theme's `light-dark()` colours follow.
 */
@Injectable({ providedIn: 'root' })
export class ThemePreference {
  private readonly storage = inject(BROWSER_STORAGE);
  private readonly document = inject(DOCUMENT);
  private readonly systemPrefersDark = signal(false);

  /** The user's choice. */
  readonly mode = signal<ThemeMode>(this.readMode());
  /** Whether the dark theme is showing now. */
  readonly isDark = computed(() => {
    const mode = this.mode();
    return mode === 'dark' || (mode === 'system' && this.systemPrefersDark());
  });

  constructor() {
    const query = this.document.defaultView?.matchMedia?.('(prefers-color-scheme: dark)');
    if (query) {
      this.systemPrefersDark.set(query.matches);
      const onChange = (event: MediaQueryListEvent): void => {
        this.systemPrefersDark.set(event.matches);
        this.apply();
      };
      query.addEventListener('change', onChange);
      inject(DestroyRef).onDestroy(() => query.removeEventListener('change', onChange));
    }
    this.apply();
  }

  /** Switches to the other theme from the one showing, and remembers the choice. */
  toggle(): void {
    this.setMode(this.isDark() ? 'light' : 'dark');
  }

  /** Sets the theme; `system` forgets the choice and follows the device again. */
  setMode(mode: ThemeMode): void {
    this.mode.set(mode);
    try {
      if (mode === 'system') {
        this.storage.removeItem(THEME_STORAGE_KEY);
      } else {
        this.storage.setItem(THEME_STORAGE_KEY, mode);
      }
    } catch {
      // Storage refused: the choice lasts for this visit.
    }
    this.apply();
  }

  private readMode(): ThemeMode {
    try {
      const stored = this.storage.getItem(THEME_STORAGE_KEY);
      return stored === 'light' || stored === 'dark' ? stored : 'system';
    } catch {
      return 'system';
    }
  }

  private apply(): void {
    const root = this.document.documentElement;
    const mode = this.mode();
    if (mode === 'system') {
      root.removeAttribute('data-theme');
    } else {
      root.setAttribute('data-theme', mode);
    }
    const meta = this.document.querySelector('meta[name="theme-color"]');
    meta?.setAttribute('content', this.isDark() ? CHROME_COLOURS.dark : CHROME_COLOURS.light);
  }
}
