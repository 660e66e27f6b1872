/**
 * The sandbox's words and numbers: the results table's rows and the charts' text alternatives, from the
 * same figures, so the table, the charts' accessible names and the screen never disagree.
 */

import { WALL_DISTANCE_M, type Flight } from '../../../shared/flight';
import { KICK_NAMES, type FlightFigures, type GoalLineVerdict } from './sandbox-kick';

/** One row of the results table: a figure and its value for each kick. */
export interface FigureRow {
  readonly id: string;
  readonly label: string;
  readonly values: readonly string[];
}

const VERDICT_TEXT: Record<GoalLineVerdict, string> = {
  in: 'in, under the bar',
  over: 'over the bar',
  wide: 'wide of the posts',
  short: 'short of the line',
};

function metres(v: number | null, none: string): string {
  return v === null ? none : `${v.toFixed(2)} m`;
}

/** Rows of the results table, one column per kick. */
export function figureRows(figures: readonly FlightFigures[]): FigureRow[] {
  const row = (id: string, label: string, value: (f: FlightFigures) => string): FigureRow => ({ id, label, values: figures.map(value) });
  return [
    row('carry', 'Carry', (f) => (f.landed ? `${f.carryM.toFixed(1)} m` : `${f.carryM.toFixed(1)} m (still in the air after 30 s)`)),
    row('apex', 'Apex', (f) => `${f.apexM.toFixed(2)} m`),
    row('time', 'Flight time', (f) => `${f.flightTimeS.toFixed(2)} s`),
    row('landing', 'Landing speed', (f) => `${f.landingSpeedMs.toFixed(1)} m/s`),
    row('wall', `Underside at ${WALL_DISTANCE_M} m`, (f) => metres(f.wallHeightM, 'landed before')),
    row('goal', 'Top of ball at goal line', (f) => metres(f.goalTopHeightM, 'landed before')),
    row('verdict', 'At the goal line', (f) => VERDICT_TEXT[f.goalVerdict]),
  ];
}

/** The side view in words: each kick's carry, apex and what it does at the wall and the goal. */
export function sideSummary(figures: readonly FlightFigures[], goalDistanceM: number): string {
  if (figures.length === 0) return 'Side view: computing the flight.';
  const parts = figures.map((f, i) => {
    const wall =
      f.wallHeightM === null ? `lands before ${WALL_DISTANCE_M} m` : `passes ${WALL_DISTANCE_M} m at ${f.wallHeightM.toFixed(2)} m`;
    return `kick ${KICK_NAMES[i]} carries ${f.carryM.toFixed(1)} m with an apex of ${f.apexM.toFixed(2)} m, ${wall}, and is ${VERDICT_TEXT[f.goalVerdict]} at ${goalDistanceM} m`;
  });
  return `Side view of height over distance: ${parts.join('; ')}.`;
}

/** The top view in words: where each kick lands across the aim line. */
export function topSummary(flights: readonly Flight[]): string {
  if (flights.length === 0) return 'Top view: computing the flight.';
  const parts = flights.map((f, i) => {
    const y = f.landing.y;
    const side = Math.abs(y) < 0.05 ? 'on the aim line' : `${Math.abs(y).toFixed(1)} m ${y > 0 ? 'left' : 'right'} of the aim line`;
    return `kick ${KICK_NAMES[i]} lands ${f.landing.x.toFixed(1)} m out, ${side}`;
  });
  return `Top view: ${parts.join('; ')}.`;
}
