import type { ProfileEntry } from '../../../shared/schemas/analysis';
import type { Technique } from '../../../shared/schemas/sync';
import { formatRange } from '../ui/charts/chart-format';
import type { ReachAnalysis } from '../core/analysis/reach-envelopes';

/** Where one technique's reach stands on the Player file. */
export type TechniqueReach =
  | { readonly technique: Technique; readonly status: 'loading' }
  | { readonly technique: Technique; readonly status: 'error'; readonly message: string }
  /** No profile: no repetitions yet, or (pending) the server is still fitting one. */
  | { readonly technique: Technique; readonly status: 'empty'; readonly entry: ProfileEntry }
  | { readonly technique: Technique; readonly status: 'computing'; readonly entry: ProfileEntry }
  | { readonly technique: Technique; readonly status: 'ready'; readonly entry: ProfileEntry; readonly analysis: ReachAnalysis };

/** Reliable reach as a headline, e.g. "31.4 m"; "none yet" when no distance reaches 60 %. */
export function reachHeadline(reach: TechniqueReach): string {
  if (reach.status === 'ready') {
    return reach.analysis.reliableReachM === null ? 'none yet' : `${reach.analysis.reliableReachM.toFixed(1)} m`;
  }
  if (reach.status === 'computing' || reach.status === 'empty') {
    return reach.entry.reliableReachM === null ? '–' : `${reach.entry.reliableReachM.toFixed(1)} m`;
  }
  return '–';
}

/**
 * What qualifies the headline: the range of reliable reach over ±1 standard error of the fitted
 * mean launch speed ("likely 29.9–32.8 m"), or, when no distance reaches 60 %, the best chance
 * any distance has ("best 38 % at 34.5 m"), so "none yet" still tells the coach how far off it is.
 */
export function reachUncertainty(analysis: ReachAnalysis): string {
  const best = `best ${Math.round(analysis.bestTarget.probability * 100)} % at ${analysis.bestTarget.distanceM} m`;
  if (analysis.reliableReachM === null) {
    return best;
  }
  if (!analysis.hasRange) {
    return '';
  }
  const low = analysis.reliableReachLowM;
  const high = analysis.reliableReachHighM;
  if (low === null) {
    return `up to ${(high ?? analysis.reliableReachM).toFixed(1)} m within ±1 standard error of launch speed`;
  }
  if (high === null) {
    return `at least ${low.toFixed(1)} m within ±1 standard error of launch speed`;
  }
  return `likely ${formatRange(low, high, 'metres')} (±1 standard error of launch speed)`;
}
