import { WALL_DISTANCE_M, setPieceCheck } from '../../../shared/flight';
import { setPieceRank } from '../flight/set-piece-rank';
import { wallPlacement } from '../ui/pitch-markings';
import { FIXTURE_PROFILES } from './planner-fixture';
import { clampBall, profilesCacheKey, profilesFingerprint, rankSetPiece, resultsCacheKey } from './planner-rank';

describe('clampBall', () => {
  it('leaves a ball where the wall stands in front of the goal line alone', () => {
    expect(clampBall({ x: -6, y: 22 })).toEqual({ x: -6, y: 22 });
  });

  it('pushes a ball too close to goal straight out until the wall is 0.5 m or more in front of the line', () => {
    for (const p of [
      { x: 0, y: 4 },
      { x: 3, y: 1 },
      { x: -8, y: 2 },
    ]) {
      const c = clampBall(p);
      // IFAB Laws of the Game, Law 13: the wall 9.15 m from the ball.
      const wall = wallPlacement(c);
      expect(wall.centre.y).toBeGreaterThanOrEqual(0.5);
      expect(Math.hypot(c.x - wall.centre.x, c.y - wall.centre.y)).toBeCloseTo(WALL_DISTANCE_M, 6);
      // Same direction from the goal's centre as the ball was dropped.
      expect(Math.atan2(c.y, c.x)).toBeCloseTo(Math.atan2(p.y, p.x), 1);
      expect(() =>
        setPieceCheck({ ballX: c.y, ballY: -c.x, profile: FIXTURE_PROFILES.players[2]!.profile!, conditions: {}, samples: 1, seed: 1 }),
      ).not.toThrow();
    }
  });

  it('keeps the ball on the attacking half of a 105 × 68 m pitch', () => {
    expect(clampBall({ x: 50, y: 80 })).toEqual({ x: 34, y: 52.5 });
  });
});

describe('rankSetPiece', () => {
  const spot = { ballX: 22, ballY: 6, wallHeightM: 2, conditions: {}, samples: 200, seed: 3 };
  const players = FIXTURE_PROFILES.players.flatMap((p) => (p.profile ? [{ id: p.playerId, profile: p.profile }] : []));

  it('orders players by their share in under the bar, those without a profile last', () => {
    const entries = setPieceRank({ ...spot, players });
    const ranked = rankSetPiece(FIXTURE_PROFILES, entries);
    const expected = players
      .map((p) => ({ id: p.id, share: setPieceCheck({ ...spot, profile: p.profile }).shares.onTarget }))
      .sort((a, b) => b.share - a.share);
    expect(new Set(expected.map((e) => e.share)).size).toBe(3);
    expect(ranked.map((r) => r.playerId)).toEqual([...expected.map((e) => e.id), FIXTURE_PROFILES.players[3]!.playerId]);
    expect(ranked.map((r) => r.rank)).toEqual([1, 2, 3, null]);
  });

  it('breaks a tie by the share over the wall, then by name', () => {
    const [a, b, c] = players;
    const shares = (onTarget: number, clearsWall: number) => ({
      onTarget,
      clearsWall,
      blocked: 0,
      shortOfWall: 0,
      shortOfGoal: 0,
      wide: 0,
      over: 0,
    });
    const fake = (id: string, onTarget: number, clearsWall: number) => {
      const e = setPieceRank({ ...spot, samples: 1, players: [{ id, profile: a!.profile }] })[0]!;
      return { ...e, result: { ...e.result, shares: shares(onTarget, clearsWall) } };
    };
    const ranked = rankSetPiece(FIXTURE_PROFILES, [fake(a!.id, 0.2, 0.5), fake(b!.id, 0.2, 0.7), fake(c!.id, 0.2, 0.5)]);
    // Ada and Cy tie on both shares: Ada first by name.
    expect(ranked.slice(0, 3).map((r) => r.displayName)).toEqual(['Bo Brennan', 'Ada Lovelock', 'Cy Okafor']);
  });
});

describe('planner cache keys', () => {
  it('round the spot so nearby drags share a key and name every input', () => {
    const k = resultsCacheKey('s1', 'curled', { ball: { x: -6.04, y: 22.01 }, wallHeightM: 2, aimXM: 0 });
    expect(k).toBe('planner:s1:curled:-6.0:22.0:2.00:0.0');
    expect(resultsCacheKey('s1', 'curled', { ball: { x: -6.01, y: 21.98 }, wallHeightM: 2.001, aimXM: 0.02 })).toBe(k);
    expect(resultsCacheKey('s1', 'lofted', { ball: { x: -6, y: 22 }, wallHeightM: 2, aimXM: 0 })).not.toBe(k);
    expect(profilesCacheKey('s1', 'curled')).toBe('planner-profiles:s1:curled');
  });

  it('change the fingerprint when a profile is recomputed', () => {
    const later = {
      ...FIXTURE_PROFILES,
      players: FIXTURE_PROFILES.players.map((p, i) => (i === 0 ? { ...p, computedAt: '2026-12-01T08:00:00.000Z' } : p)),
    };
    expect(profilesFingerprint(later)).not.toBe(profilesFingerprint(FIXTURE_PROFILES));
  });
});
