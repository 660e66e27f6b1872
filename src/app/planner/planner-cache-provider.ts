import type { Provider } from '@angular/core';
import { PLANNER_CACHE, type PlannerCache } from './planner-cache';

/**
 * TEMPORARY until `src/app/core/analysis-cache.ts` lands (TODO(planner): replace with
 * `{ provide: PLANNER_CACHE, useExisting: AnalysisCache }`): keeps values for the browser tab only.
 */
const memory = new Map<string, unknown>();
const tabCache: PlannerCache = {
  get: <T>(key: string) => Promise.resolve(memory.get(key) as T | undefined),
  put: <T>(key: string, _kind: string, value: T) => {
    memory.set(key, structuredClone(value));
    return Promise.resolve();
  },
};

/** Where the planner keeps its squads, profiles and rankings. */
export const PLANNER_CACHE_PROVIDER: Provider = { provide: PLANNER_CACHE, useValue: tabCache };
