import { Injectable, computed, inject, signal } from '@angular/core';
import { BROWSER_STORAGE } from '../core/browser-storage';
import type { KickColumns, KickField, KickUnits } from './import-types';
import { columnIndex } from './local-csv';

/** The localStorage key of the saved mappings (versioned so a format change can start clean). */
export const DEVICE_MAPPINGS_KEY = 'loftline.import-devices.v1';

/** A column mapping remembered under a device's name. */
export interface SavedDeviceMapping {
  /** The device's name as the coach typed it. */
  readonly device: string;
  readonly columns: KickColumns;
  readonly units: KickUnits;
  /** When it was last saved (ISO 8601), to offer the most recent first. */
  readonly savedAt: string;
}

const FIELDS: readonly KickField[] = ['player', 'time', 'speed', 'launchAngle', 'spin', 'carry', 'lateral'];

/**
 * Column mappings per measuring device, kept on this device (localStorage).
 *
 * The same device exports the same columns every time, so a coach maps a device's file once and
 * later imports only confirm. Kept on the device rather than the server because a mapping names
 * nothing but column headers and units, and because the wizard must offer it before any upload.
 * Names are matched without regard to case or surrounding spaces.
 */
@Injectable({ providedIn: 'root' })
export class DeviceMappings {
  private readonly storage = inject(BROWSER_STORAGE);
  private readonly entries = signal<readonly SavedDeviceMapping[]>(this.restore());

  /** Every saved mapping, the most recently saved first. */
  readonly saved = computed(() => [...this.entries()].sort((a, b) => b.savedAt.localeCompare(a.savedAt)));

  /** The mapping saved under `device`, or null. */
  find(device: string): SavedDeviceMapping | null {
    const key = normalise(device);
    return key === '' ? null : (this.entries().find((entry) => normalise(entry.device) === key) ?? null);
  }

  /**
   * The most recently saved mapping whose every column is in `header`: the device this file
   * most likely came from. Null when none fits.
   */
  bestFor(header: readonly string[]): SavedDeviceMapping | null {
    return this.saved().find((entry) => missingColumns(entry, header).length === 0) ?? null;
  }

  /** Saves (or replaces) the mapping of `device`. Blank names are not saved. */
  save(device: string, columns: KickColumns, units: KickUnits, now = new Date()): void {
    const name = device.trim();
    if (name === '') return;
    const entry: SavedDeviceMapping = { device: name, columns, units, savedAt: now.toISOString() };
    this.persist([...this.entries().filter((e) => normalise(e.device) !== normalise(name)), entry]);
  }

  /** Forgets the mapping of `device`. */
  forget(device: string): void {
    this.persist(this.entries().filter((e) => normalise(e.device) !== normalise(device)));
  }

  private persist(entries: readonly SavedDeviceMapping[]): void {
    this.entries.set(entries);
    try {
      this.storage.setItem(DEVICE_MAPPINGS_KEY, JSON.stringify(entries));
    } catch {
      // Storage full or refused: the mapping still helps for the rest of this visit.
    }
  }

  private restore(): SavedDeviceMapping[] {
    try {
      const parsed: unknown = JSON.parse(this.storage.getItem(DEVICE_MAPPINGS_KEY) ?? '[]');
      return Array.isArray(parsed) ? parsed.filter(isSavedMapping) : [];
    } catch {
      return [];
    }
  }
}

/** The saved columns of `entry` that `header` lacks. */
export function missingColumns(entry: SavedDeviceMapping, header: readonly string[]): string[] {
  return FIELDS.map((field) => entry.columns[field]).filter(
    (column): column is string => column !== undefined && columnIndex(header, column) < 0,
  );
}

function normalise(device: string): string {
  return device.trim().toLowerCase();
}

function isSavedMapping(value: unknown): value is SavedDeviceMapping {
  if (typeof value !== 'object' || value === null) return false;
  const record = value as Record<string, unknown>;
  const columns = record['columns'];
  const units = record['units'];
  if (typeof record['device'] !== 'string' || typeof record['savedAt'] !== 'string') return false;
  if (typeof columns !== 'object' || columns === null || typeof units !== 'object' || units === null) return false;
  const c = columns as Record<string, unknown>;
  const u = units as Record<string, unknown>;
  return (
    typeof c['player'] === 'string' &&
    FIELDS.every((field) => c[field] === undefined || typeof c[field] === 'string') &&
    ['m/s', 'km/h', 'mph'].includes(String(u['speed'])) &&
    ['rev/s', 'rpm'].includes(String(u['spin'])) &&
    ['m', 'yd'].includes(String(u['distance']))
  );
}
