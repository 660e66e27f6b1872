import { Injectable, inject, signal } from '@angular/core';
import { BROWSER_STORAGE } from '../core/browser-storage';

const STORAGE_KEY = 'loftline.stopwatchDrills';
/** Most drill ids remembered (oldest dropped first); a season of sessions stays well below it. */
const MAX_REMEMBERED = 500;

/**
 * Which drills have the hang-time stopwatch on. A per-device preference, not synced: the stopwatch is a
 * way of logging on this phone, and a second coach logging the same drill may not be timing. Kept in
 * browser storage so a reload mid-drill keeps the mode.
 */
@Injectable({ providedIn: 'root' })
export class StopwatchDrills {
  private readonly storage = inject(BROWSER_STORAGE);
  private readonly on = signal<readonly string[]>(this.read());

  /** Ids of the drills with the stopwatch on. */
  readonly drillIds = this.on.asReadonly();

  /** Whether the stopwatch is on for a drill. */
  isOn(drillId: string): boolean {
    return this.on().includes(drillId);
  }

  /** Turns the stopwatch on or off for a drill. */
  set(drillId: string, enabled: boolean): void {
    const rest = this.on().filter((id) => id !== drillId);
    const next = enabled ? [...rest, drillId].slice(-MAX_REMEMBERED) : rest;
    this.on.set(next);
    this.storage.setItem(STORAGE_KEY, JSON.stringify(next));
  }

  private read(): string[] {
    try {
      const value: unknown = JSON.parse(this.storage.getItem(STORAGE_KEY) ?? '[]');
      return Array.isArray(value) ? value.filter((v): v is string => typeof v === 'string') : [];
    } catch {
      return [];
    }
  }
}
