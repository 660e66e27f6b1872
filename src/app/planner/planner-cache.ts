import { InjectionToken } from '@angular/core';

/**
 * What the planner keeps on the device so a reopened planner shows its last squads, profiles and
 * rankings without signal: the app's analysis cache (IndexedDB) seen through the two calls the planner
 * uses. A token so specs can hand in a cache of their own.
 */
export interface PlannerCache {
  /** The value stored under `key`, if any. */
  get<T>(key: string): Promise<T | undefined>;
  /** Store `value` under `key`; `kind` names what it is (for clean-up by kind). */
  put<T>(key: string, kind: string, value: T): Promise<void>;
}

/** The planner's offline cache (the planner screen provides the app's `AnalysisCache` under it). */
export const PLANNER_CACHE = new InjectionToken<PlannerCache>('PLANNER_CACHE');
