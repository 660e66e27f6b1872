import { TestBed } from '@angular/core/testing';
import { ANALYSIS_CACHE_LIMIT, AnalysisCache } from './analysis-cache';
import { LOFTLINE_DB, type LoftlineDb } from '../loftline-db';
import { freshDb } from '../spec-support';

describe('AnalysisCache', () => {
  let db: LoftlineDb;
  let cache: AnalysisCache;

  beforeEach(() => {
    db = freshDb();
    TestBed.configureTestingModule({ providers: [{ provide: LOFTLINE_DB, useValue: db }] });
    cache = TestBed.inject(AnalysisCache);
  });
  afterEach(async () => {
    db.close();
    await db.delete();
  });

  it('keeps a value in IndexedDB across a reopen of the database', async () => {
    await cache.put('profile:p1:lofted', 'profile', { meanSpeedMs: 22.5, cloud: [1, 2, 3] });
    db.close();
    await db.open();
    expect(await cache.get<{ meanSpeedMs: number; cloud: number[] }>('profile:p1:lofted')).toEqual({ meanSpeedMs: 22.5, cloud: [1, 2, 3] });
    expect(await cache.get('missing')).toBeUndefined();
  });

  it('replaces a value under the same key and clears a kind', async () => {
    await cache.put('week:s1', 'week', 1);
    await cache.put('week:s1', 'week', 2);
    await cache.put('envelope:x', 'envelope', 3);
    expect(await cache.get('week:s1')).toBe(2);
    await cache.clearKind('week');
    expect(await cache.get('week:s1')).toBeUndefined();
    expect(await cache.get('envelope:x')).toBe(3);
  });

  it('drops the oldest entries beyond its limit', async () => {
    await db.analysisCache.bulkPut(
      Array.from({ length: ANALYSIS_CACHE_LIMIT }, (_, i) => ({
        key: `k${i}`,
        kind: 'envelope',
        value: i,
        updatedAt: new Date(2026, 0, 1, 0, 0, i).toISOString(),
      })),
    );
    await cache.put('newest', 'envelope', 'n');
    expect(await db.analysisCache.count()).toBe(ANALYSIS_CACHE_LIMIT);
    expect(await cache.get('k0')).toBeUndefined();
    expect(await cache.get('newest')).toBe('n');
  });
});
