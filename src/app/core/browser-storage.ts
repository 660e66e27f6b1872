import { InjectionToken } from '@angular/core';

/**
 * The key-value store that keeps the session and preferences across reloads and weeks of
 * use on a phone. An injection token rather than the `localStorage` global so specs can
 * give each test a fresh, isolated store, and so a browser that refuses storage (private
 * mode with storage disabled) degrades to memory instead of throwing at start-up.
 */
export const BROWSER_STORAGE = new InjectionToken<Storage>('BROWSER_STORAGE', {
  providedIn: 'root',
  factory: () => {
    try {
      const storage = globalThis.localStorage;
      const probe = '__loftline_probe__';
      storage.setItem(probe, probe);
      storage.removeItem(probe);
      return storage;
    } catch {
      return new MemoryStorage();
    }
  },
});

/**
 * A `Storage` kept in memory: the fallback when the browser refuses localStorage, and the
 * store specs provide for `BROWSER_STORAGE`.
 */
export class MemoryStorage implements Storage {
  private readonly entries = new Map<string, string>();

  get length(): number {
    return this.entries.size;
  }

  clear(): void {
    this.entries.clear();
  }

  getItem(key: string): string | null {
    return this.entries.get(key) ?? null;
  }

  key(index: number): string | null {
    return [...this.entries.keys()][index] ?? null;
  }

  removeItem(key: string): void {
    this.entries.delete(key);
  }

  setItem(key: string, value: string): void {
    this.entries.set(key, String(value));
  }
}
