import { curveHitProbability, type ReachCurve } from '../../../../shared/flight';
import type { Technique } from '../../../../shared/schemas/sync';

/** Hit probability band of a "next target": hard enough to stretch, easy enough to succeed. */
export const NEXT_TARGET_BAND = { min: 0.5, max: 0.6, aim: 0.55 } as const;

/** Spacing of the distances tried, metres (a cone can be placed to half a metre). */
export const NEXT_TARGET_GRID_M = 0.5;

/** The outcome of the search for next week's target distance. */
export type NextTargetResult =
  | { readonly kind: 'target'; readonly distanceM: number; readonly radiusM: number; readonly probability: number }
  | {
      /** No distance on the grid falls inside the band. */
      readonly kind: 'none';
      readonly radiusM: number;
      /** The distance beyond the peak whose probability is nearest the aim, for the explanation. */
      readonly nearestDistanceM: number | null;
      readonly nearestProbability: number | null;
      /** The highest probability any distance reaches with this radius. */
      readonly peakProbability: number;
    };

/**
 * Next week's drill target for one technique: on a 0.5 m grid along the aim line, the distance
 * whose predicted hit probability (for a target of `radiusM`) is closest to 55 %, within 50–60 %.
 * Only distances at or beyond the most reliable one count: the edge of reach lies on the far
 * side, and the short side of the envelope would give the same percentage for an easier ball.
 * Ties go to the longer distance.
 */
export function nextTarget(curve: ReachCurve, radiusM: number): NextTargetResult {
  const grid = hitCurve(curve, radiusM);
  const peak = peakIndex(grid);
  let best: { distanceM: number; probability: number } | null = null;
  let nearest: { distanceM: number; probability: number } | null = null;
  for (let i = peak; i < grid.length; i++) {
    const point = grid[i]!;
    const gap = Math.abs(point.probability - NEXT_TARGET_BAND.aim);
    if (nearest === null || gap <= Math.abs(nearest.probability - NEXT_TARGET_BAND.aim)) {
      nearest = point;
    }
    if (point.probability >= NEXT_TARGET_BAND.min && point.probability <= NEXT_TARGET_BAND.max) {
      if (best === null || gap <= Math.abs(best.probability - NEXT_TARGET_BAND.aim)) {
        best = point;
      }
    }
  }
  if (best !== null) {
    return { kind: 'target', distanceM: best.distanceM, radiusM, probability: best.probability };
  }
  return {
    kind: 'none',
    radiusM,
    nearestDistanceM: nearest?.distanceM ?? null,
    nearestProbability: nearest?.probability ?? null,
    peakProbability: grid[peak]?.probability ?? 0,
  };
}

/** Predicted hit probability of kicks aimed at every 0.5 m out to the end of the reach curve. */
export function hitCurve(curve: ReachCurve, radiusM: number): { distanceM: number; probability: number }[] {
  const last = curve.distancesM[curve.distancesM.length - 1];
  if (last === undefined) {
    throw new RangeError('reach curve has no distances');
  }
  const grid: { distanceM: number; probability: number }[] = [];
  for (let k = 1; k * NEXT_TARGET_GRID_M <= last + 1e-9; k++) {
    const distanceM = k * NEXT_TARGET_GRID_M;
    grid.push({ distanceM, probability: curveHitProbability(curve, distanceM, radiusM) });
  }
  return grid;
}

function peakIndex(grid: readonly { probability: number }[]): number {
  let peak = 0;
  for (let i = 1; i < grid.length; i++) {
    if (grid[i]!.probability > grid[peak]!.probability) {
      peak = i;
    }
  }
  return peak;
}

/** The distance on the grid a player is most likely to hit with a target of `radiusM`, and how likely. */
export function bestTarget(curve: ReachCurve, radiusM: number): { distanceM: number; probability: number } {
  const grid = hitCurve(curve, radiusM);
  return grid[peakIndex(grid)]!;
}

/** The query parameters that open Pitchside with a drill filled in. */
export interface DrillQueryParams {
  readonly drillTechnique: Technique;
  readonly drillTargetM: number;
  readonly drillRadiusM: number;
}

/**
 * Where "add as drill" goes: Pitchside, told the technique, distance and radius of the drill to
 * set up (Pitchside fills its drill form from these).
 */
export function drillLink(technique: Technique, distanceM: number, radiusM: number): { path: string; queryParams: DrillQueryParams } {
  return { path: '/pitchside', queryParams: { drillTechnique: technique, drillTargetM: distanceM, drillRadiusM: radiusM } };
}

/** A sentence explaining a next-target result, e.g. for the table and screen readers. */
export function describeNextTarget(result: NextTargetResult): string {
  if (result.kind === 'target') {
    return `${result.distanceM} m with a ${result.radiusM} m target: ${Math.round(result.probability * 100)} % predicted hits`;
  }
  if (result.peakProbability < NEXT_TARGET_BAND.min) {
    return `None: at best ${Math.round(result.peakProbability * 100)} % predicted hits with a ${result.radiusM} m target. Try a larger target.`;
  }
  const near =
    result.nearestDistanceM === null || result.nearestProbability === null
      ? ''
      : ` (nearest: ${result.nearestDistanceM} m at ${Math.round(result.nearestProbability * 100)} %)`;
  return `None in the 50–60 % band with a ${result.radiusM} m target${near}`;
}
