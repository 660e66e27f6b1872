import type { PlayerKick, ProgressWeek } from '../../../shared/schemas/analysis';
import type { Technique } from '../../../shared/schemas/sync';
import type { OutcomeWeek } from '../ui/charts/outcome-mix-chart';
import type { ProgressPoint } from '../ui/charts/progress-chart';

/*
 * Pure shaping of the Player file's answers into what its charts draw, kept apart from the
 * component so each rule (which weeks, which band, which targets) is tested on its own.
 */

/** How many of the latest weeks the progress charts show. */
export const PROGRESS_WEEKS_SHOWN = 16;

/** What the progress line shows. */
export type ProgressMetric = 'carry' | 'hitRate';

/** z for a two-sided 95 % interval. */
const Z_95 = 1.959964;

/**
 * Wilson score interval for a binomial proportion (Wilson 1927, J. Am. Stat. Assoc. 22:209): unlike
 * p ± z·SE it stays inside [0, 1] and does not collapse to zero width at 0 % or 100 % from few reps.
 */
export function wilsonInterval(successes: number, trials: number, z: number = Z_95): { low: number; high: number } {
  if (trials <= 0) {
    return { low: 0, high: 1 };
  }
  const p = successes / trials;
  const z2 = z * z;
  const denominator = 1 + z2 / trials;
  const centre = (p + z2 / (2 * trials)) / denominator;
  const half = (z * Math.sqrt((p * (1 - p)) / trials + z2 / (4 * trials * trials))) / denominator;
  return { low: Math.max(0, centre - half), high: Math.min(1, centre + half) };
}

/** The latest weeks of one technique, oldest first. */
export function weeksOf(weeks: readonly ProgressWeek[], technique: Technique, limit: number = PROGRESS_WEEKS_SHOWN): ProgressWeek[] {
  return weeks
    .filter((w) => w.technique === technique && w.reps > 0)
    .sort((a, b) => a.weekStart.localeCompare(b.weekStart))
    .slice(-limit);
}

/**
 * Progress points of one technique: median carry with its middle half (weeks without a carry are
 * left out), or hit rate with its 95 % Wilson interval.
 */
export function progressPoints(weeks: readonly ProgressWeek[], technique: Technique, metric: ProgressMetric): ProgressPoint[] {
  const chosen = weeksOf(weeks, technique);
  if (metric === 'hitRate') {
    return chosen.map((w) => {
      const band = wilsonInterval(Math.round(w.hitRate * w.reps), w.reps);
      return { weekStart: w.weekStart, value: w.hitRate, low: band.low, high: band.high, reps: w.reps };
    });
  }
  return chosen
    .filter((w) => w.medianCarryM !== null)
    .map((w) => ({
      weekStart: w.weekStart,
      value: w.medianCarryM as number,
      low: w.carryP25M,
      high: w.carryP75M,
      reps: w.carryCount,
    }));
}

/** The outcome mix of one technique per week, oldest first. */
export function outcomeWeeks(weeks: readonly ProgressWeek[], technique: Technique): OutcomeWeek[] {
  return weeksOf(weeks, technique).map((w) => ({ weekStart: w.weekStart, reps: w.reps, share: w.outcomeShare }));
}

/** A target the player has trained at, with how often. */
export interface DrillTarget {
  readonly distanceM: number;
  readonly radiusM: number;
  readonly reps: number;
}

/** The drill targets of one technique among the kicks, most used first (at most `limit`). */
export function drillTargets(kicks: readonly PlayerKick[], technique: Technique, limit = 4): DrillTarget[] {
  const counts = new Map<string, DrillTarget>();
  for (const k of kicks) {
    if (k.technique !== technique) continue;
    const key = `${k.targetDistanceM}|${k.targetRadiusM}`;
    const seen = counts.get(key);
    counts.set(key, { distanceM: k.targetDistanceM, radiusM: k.targetRadiusM, reps: (seen?.reps ?? 0) + 1 });
  }
  return [...counts.values()].sort((a, b) => b.reps - a.reps || a.distanceM - b.distanceM).slice(0, limit);
}

/** The technique with the most repetitions in the progress answer, if any. */
export function busiestTechnique(weeks: readonly ProgressWeek[]): Technique | null {
  const totals = new Map<Technique, number>();
  for (const w of weeks) {
    totals.set(w.technique, (totals.get(w.technique) ?? 0) + w.reps);
  }
  let best: Technique | null = null;
  for (const [technique, reps] of totals) {
    if (best === null || reps > (totals.get(best) ?? 0)) best = technique;
  }
  return best;
}
