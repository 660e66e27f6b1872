/**
 * A player's progress per ISO week (Monday start, UTC) and technique, computed in SQLite:
 * repetitions, hit rate, outcome shares and the median and spread of logged carry. Only
 * aggregates leave the database; the kicks_player_recorded index serves the range scan.
 */
import type { CarryBasis, ProgressWeek } from '../../shared/schemas/analysis';
import type { Outcome, Technique } from '../../shared/schemas/sync';
import { OUTCOMES } from '../../shared/schemas/sync';
import { addDays } from '../../shared/dates';
import type { Db } from '../db/client';

/** Filters for a progress query. */
export interface ProgressFilter {
  from?: string;
  to?: string;
  technique?: Technique;
  /** Logged carry (default) or carry normalised to still air. */
  carry?: CarryBasis;
}

interface AggregateRow {
  week: string;
  technique: Technique;
  reps: number;
  carry_n: number;
  carry_mean: number | null;
  carry_sq: number | null;
  [key: `n_${string}`]: number;
}

interface QuantileRow {
  week: string;
  technique: Technique;
  p25: number | null;
  p50: number | null;
  p75: number | null;
}

const WEEK = `date(k.recorded_at, 'weekday 0', '-6 days')`;

/** Progress of one player (visibility already checked by the caller). */
export function playerProgress(db: Db, playerId: string, filter: ProgressFilter): ProgressWeek[] {
  const where = ['k.player_id = @playerId', 'k.deleted_at IS NULL'];
  if (filter.from) where.push('k.recorded_at >= @from');
  if (filter.to) where.push('k.recorded_at < @toExclusive');
  if (filter.technique) where.push('k.technique = @technique');
  const params = {
    playerId,
    from: filter.from ?? null,
    toExclusive: filter.to ? addDays(filter.to, 1) : null,
    technique: filter.technique ?? null,
  };
  const carry = filter.carry === 'still-air' ? 'k.still_air_carry_m' : 'k.carry_m';
  const outcomeCounts = OUTCOMES.map((o) => `SUM(k.outcome = '${o}') AS n_${o}`).join(', ');
  const aggregates = db.$client
    .prepare(
      `SELECT ${WEEK} AS week, k.technique AS technique, COUNT(*) AS reps, ${outcomeCounts},
              COUNT(${carry}) AS carry_n, AVG(${carry}) AS carry_mean, AVG(${carry} * ${carry}) AS carry_sq
         FROM kicks k WHERE ${where.join(' AND ')}
        GROUP BY week, technique ORDER BY week, technique`,
    )
    .all(params) as AggregateRow[];
  // Nearest-rank quartiles from window functions: row i of n (1-based) is the q-quantile when i = ceil(q·n).
  const quantiles = db.$client
    .prepare(
      `WITH ranked AS (
         SELECT ${WEEK} AS week, k.technique AS technique, ${carry} AS carry,
                ROW_NUMBER() OVER (PARTITION BY ${WEEK}, k.technique ORDER BY ${carry}) AS i,
                COUNT(*) OVER (PARTITION BY ${WEEK}, k.technique) AS n
           FROM kicks k WHERE ${where.join(' AND ')} AND ${carry} IS NOT NULL)
       SELECT week, technique,
              MAX(CASE WHEN i = MAX(1, CAST(ceil(0.25 * n) AS INTEGER)) THEN carry END) AS p25,
              MAX(CASE WHEN n % 2 = 1 AND i = (n + 1) / 2 THEN carry END) AS p50_odd,
              AVG(CASE WHEN n % 2 = 0 AND (i = n / 2 OR i = n / 2 + 1) THEN carry END) AS p50_even,
              MAX(CASE WHEN i = MAX(1, CAST(ceil(0.75 * n) AS INTEGER)) THEN carry END) AS p75
         FROM ranked GROUP BY week, technique`,
    )
    .all(params) as (Omit<QuantileRow, 'p50'> & { p50_odd: number | null; p50_even: number | null })[];
  const q = new Map(quantiles.map((r) => [`${r.week}|${r.technique}`, { ...r, p50: r.p50_odd ?? r.p50_even }]));
  return aggregates.map((r) => {
    const share = Object.fromEntries(OUTCOMES.map((o) => [o, r.reps ? (r[`n_${o}`] ?? 0) / r.reps : 0])) as Record<Outcome, number>;
    const quant = q.get(`${r.week}|${r.technique}`);
    const variance =
      r.carry_n && r.carry_mean !== null && r.carry_sq !== null ? Math.max(0, r.carry_sq - r.carry_mean * r.carry_mean) : null;
    return {
      weekStart: r.week,
      technique: r.technique,
      reps: r.reps,
      hitRate: share.on_target,
      outcomeShare: share,
      carryCount: r.carry_n,
      medianCarryM: quant?.p50 ?? null,
      carryP25M: quant?.p25 ?? null,
      carryP75M: quant?.p75 ?? null,
      carrySdM: variance === null ? null : Math.sqrt(variance),
    };
  });
}
