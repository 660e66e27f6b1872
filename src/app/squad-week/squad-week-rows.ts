import { DISTANCE_UNIT_WORDS, metresTo, type DistanceUnit } from '../../../shared/units';
import { PROFILE_WARNING_TEXT } from '../../../shared/flight';
import type { CarryBasis, SquadWeek, SquadWeekPlayer } from '../../../shared/schemas/analysis';
import type { Technique } from '../../../shared/schemas/sync';
import type { NextTargetResult } from '../core/analysis/next-target';
import { TECHNIQUE_LABELS } from '../../../shared/vocabulary';
import { toCsv, type CsvCell } from '../../../shared/csv';

/** Where a player's next target for the chosen technique stands. */
export type NextTargetState =
  | { readonly status: 'computing' }
  | { readonly status: 'unavailable'; readonly reason: string }
  | { readonly status: 'ready'; readonly result: NextTargetResult };

/** Next-target states by player id, and the state of players not (yet) in the map. */
export interface NextTargets {
  readonly byPlayer: ReadonlyMap<string, NextTargetState>;
  readonly otherwise: NextTargetState;
}

/** One player's line in the Squad week table, for the chosen technique. */
export interface SquadRow {
  readonly playerId: string;
  readonly shirtNumber: number | null;
  readonly displayName: string;
  readonly reps: number;
  readonly hitRate: number | null;
  readonly previousHitRate: number | null;
  readonly hitRateChange: number | null;
  readonly bestTechnique: Technique | null;
  readonly techniqueReps: number;
  readonly techniqueHitRate: number | null;
  readonly techniqueMedianCarryM: number | null;
  readonly reliableReachM: number | null;
  readonly reachRadiusM: number | null;
  readonly reachRepetitions: number;
  readonly reachPending: boolean;
  /** Plain words of the profile's warnings (what a coach should know before trusting the reach). */
  readonly reachWarnings: readonly string[];
  readonly next: NextTargetState;
  /** Sessions this week in which the player passed the club's repetition limit. */
  readonly loadFlags: number;
}

/** Direction of a week-on-week change, in whole percentage points. */
export interface ChangeMark {
  readonly points: number;
  readonly direction: 'up' | 'down' | 'flat';
  /** "up 8 points", for screen readers and the CSV. */
  readonly words: string;
}

/** The change of hit rate in whole points, or null when either week had no repetitions. */
export function changeMark(change: number | null): ChangeMark | null {
  if (change === null) {
    return null;
  }
  const points = Math.round(change * 100);
  if (points === 0) {
    return { points, direction: 'flat', words: 'no change' };
  }
  const direction = points > 0 ? 'up' : 'down';
  return { points, direction, words: `${direction} ${Math.abs(points)} ${Math.abs(points) === 1 ? 'point' : 'points'}` };
}

/** Every player's line for the chosen technique, in the server's order (shirt number, then name). */
export function squadRows(week: SquadWeek, technique: Technique, next: NextTargets): SquadRow[] {
  return week.players.map((p) => row(p, technique, next.byPlayer.get(p.playerId) ?? next.otherwise));
}

function row(p: SquadWeekPlayer, technique: Technique, next: NextTargetState): SquadRow {
  const tech = p.byTechnique.find((t) => t.technique === technique);
  const reach = p.reach.find((r) => r.technique === technique);
  return {
    playerId: p.playerId,
    shirtNumber: p.shirtNumber,
    displayName: p.displayName,
    reps: p.reps,
    hitRate: p.hitRate,
    previousHitRate: p.previousHitRate,
    hitRateChange: p.hitRateChange,
    bestTechnique: p.bestTechnique,
    techniqueReps: tech?.reps ?? 0,
    techniqueHitRate: tech ? tech.hitRate : null,
    techniqueMedianCarryM: tech?.medianCarryM ?? null,
    reliableReachM: reach?.reliableReachM ?? null,
    reachRadiusM: reach?.reachRadiusM ?? null,
    reachRepetitions: reach?.repetitions ?? 0,
    reachPending: reach?.pending ?? false,
    reachWarnings: (reach?.warnings ?? []).map((w) => PROFILE_WARNING_TEXT[w]),
    next,
    loadFlags: p.loadFlags.length,
  };
}

/** The technique with the most repetitions in the week (the Squad week's opening choice). */
export function busiestTechniqueOfWeek(week: SquadWeek): Technique | null {
  const totals = new Map<Technique, number>();
  for (const p of week.players) {
    for (const t of p.byTechnique) totals.set(t.technique, (totals.get(t.technique) ?? 0) + t.reps);
  }
  let best: Technique | null = null;
  for (const [t, reps] of totals) {
    if (reps > 0 && (best === null || reps > (totals.get(best) ?? 0))) best = t;
  }
  return best;
}

const pct = (v: number | null): number | null => (v === null ? null : Math.round(v * 1000) / 10);

/**
 * The table as CSV (the product's one writer, shared/csv.ts: RFC 4180, formulas defused), in the order
 * shown. Header names say the units (the club's distance unit: metres or yards), the technique and the
 * carry basis, so the file reads correctly outside Loftline. Numbers keep the point as decimal mark whatever
 * the club's locale: the comma separates fields in RFC 4180, and spreadsheets read a point-decimal CSV the
 * same everywhere on import.
 */
export function squadWeekCsv(rows: readonly SquadRow[], technique: Technique, basis: CarryBasis, unit: DistanceUnit = 'm'): string {
  const t = TECHNIQUE_LABELS[technique];
  const u = DISTANCE_UNIT_WORDS[unit].symbol;
  const distance = (v: number | null): number | null => (v === null ? null : Math.round(metresTo(v, unit) * 10) / 10);
  const carryName = basis === 'still-air' ? `median still-air carry (${u})` : `median carry (${u})`;
  const header = [
    'Shirt',
    'Player',
    'Reps',
    'Hit rate (%)',
    'Previous week hit rate (%)',
    'Change (points)',
    'Best technique',
    `${t} reps`,
    `${t} hit rate (%)`,
    `${t} ${carryName}`,
    `${t} reliable reach (${u})`,
    `${t} reach target radius (${u})`,
    `${t} next target (${u})`,
    `${t} next target predicted hits (%)`,
    'Sessions over the repetition limit',
  ];
  const lines: CsvCell[][] = [];
  for (const r of rows) {
    const next = r.next.status === 'ready' && r.next.result.kind === 'target' ? r.next.result : null;
    const change = changeMark(r.hitRateChange);
    lines.push([
      r.shirtNumber,
      r.displayName,
      r.reps,
      pct(r.hitRate),
      pct(r.previousHitRate),
      change?.points ?? null,
      r.bestTechnique ? TECHNIQUE_LABELS[r.bestTechnique] : null,
      r.techniqueReps,
      pct(r.techniqueHitRate),
      distance(r.techniqueMedianCarryM),
      distance(r.reliableReachM),
      distance(r.reachRadiusM),
      distance(next?.distanceM ?? null),
      next ? pct(next.probability) : null,
      r.loadFlags,
    ]);
  }
  return toCsv(header, lines);
}

/** A file name for the export, e.g. "squad-week-u16-2025-03-03-lofted.csv". */
export function csvFileName(squadName: string, weekStart: string, technique: Technique): string {
  const slug =
    squadName
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'squad';
  return `squad-week-${slug}-${weekStart}-${technique}.csv`;
}
