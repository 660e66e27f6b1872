import { Injectable, inject } from '@angular/core';
import { AuthSession } from '../auth/auth-session';
import { LOFTLINE_DB } from '../loftline-db';

/** Most entries kept; the oldest go first (envelopes and answers are small, but phones are not). */
export const ANALYSIS_CACHE_LIMIT = 500;

/**
 * A small key-value cache in the app's IndexedDB for analysis answers — reach envelopes,
 * profiles, progress, Squad week, planner results — so those screens open offline with the last
 * answer. Local only: nothing here is synced, and losing it costs only a recomputation.
 *
 * Every key is the signed-in user's own (`<userId>|<key>`): on a shared phone one user's cached
 * planner or Squad week is never another's answer, even offline, whatever key the screen chose.
 */
@Injectable({ providedIn: 'root' })
export class AnalysisCache {
  private readonly db = inject(LOFTLINE_DB);
  private readonly session = inject(AuthSession);

  /** The stored key of `key` for the signed-in user. */
  private userKey(key: string): string {
    return `${this.session.user()?.id ?? 'signed-out'}|${key}`;
  }

  /** The value under `key`, if cached for the signed-in user. */
  async get<T>(key: string): Promise<T | undefined> {
    const entry = await this.db.analysisCache.get(this.userKey(key));
    return entry?.value as T | undefined;
  }

  /** Stores `value` under `key` for the signed-in user, trimming the oldest entries beyond the limit. */
  async put<T>(key: string, kind: string, value: T): Promise<void> {
    const stored = this.userKey(key);
    await this.db.transaction('rw', this.db.analysisCache, async () => {
      await this.db.analysisCache.put({ key: stored, kind, value, updatedAt: new Date().toISOString() });
      const count = await this.db.analysisCache.count();
      if (count > ANALYSIS_CACHE_LIMIT) {
        const oldest = await this.db.analysisCache
          .orderBy('updatedAt')
          .limit(count - ANALYSIS_CACHE_LIMIT)
          .primaryKeys();
        await this.db.analysisCache.bulkDelete(oldest);
      }
    });
  }

  /** Removes every entry of a kind (e.g. after sign-out). */
  async clearKind(kind: string): Promise<void> {
    await this.db.analysisCache.where('kind').equals(kind).delete();
  }
}
