import { HttpClient } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import {
  DEFAULT_DISPLAY,
  DEFAULT_TIMING,
  clubSettingsSchema,
  type ClubSettings,
  type ClubSettingsUpdate,
} from '../../../shared/schemas/club';
import { BROWSER_STORAGE } from './browser-storage';

const STORAGE_KEY = 'loftline.clubSettings';

/**
 * The club's settings as this device last saw them (`GET /api/club/settings`), kept in browser storage so
 * Pitchside still knows the stopwatch calibration, the distance unit and the locale on a pitch without signal.
 * Until the first fetch the product defaults stand (common practice: 0.2 s bias, 0.08 s spread; metres, en-GB).
 */
@Injectable({ providedIn: 'root' })
export class ClubSettingsStore {
  private readonly http = inject(HttpClient);
  private readonly storage = inject(BROWSER_STORAGE);
  private readonly current = signal<ClubSettings>(
    this.readCached() ?? { timingBiasS: DEFAULT_TIMING.biasS, timingSdS: DEFAULT_TIMING.sdS, ...DEFAULT_DISPLAY },
  );

  /** The settings in force on this device. */
  readonly settings = this.current.asReadonly();

  /** Fetches the settings and caches them; a failure (offline) keeps what the device had. */
  async refresh(): Promise<void> {
    try {
      this.keep(await firstValueFrom(this.http.get<ClubSettings>('/api/club/settings')));
    } catch {
      // Offline or not staff: the cached (or default) calibration stays in force.
    }
  }

  /** Saves new settings (club admin only; the server validates again and answers 400 naming the field). */
  async save(next: ClubSettingsUpdate): Promise<ClubSettings> {
    const saved = await firstValueFrom(this.http.put<ClubSettings>('/api/club/settings', next));
    this.keep(saved);
    return saved;
  }

  private keep(value: unknown): void {
    const parsed = clubSettingsSchema.safeParse(value);
    if (!parsed.success) return;
    this.current.set(parsed.data);
    this.storage.setItem(STORAGE_KEY, JSON.stringify(parsed.data));
  }

  private readCached(): ClubSettings | null {
    try {
      const parsed = clubSettingsSchema.safeParse(JSON.parse(this.storage.getItem(STORAGE_KEY) ?? 'null'));
      return parsed.success ? parsed.data : null;
    } catch {
      return null;
    }
  }
}
