/**
 * The sandbox's words and numbers: the results table's rows and the charts' text alternatives, from the
 * same figures, so the table, the charts' accessible names and the screen never disagree. Numbers follow the
 * club's locale; distances along the ground (carry, landing point, the wall's and goal's distance) follow its
 * distance unit, while heights stay in metres like the sandbox's height controls and the charts' height axis.
 */

import { WALL_DISTANCE_M, type Flight } from '../../../shared/flight';
import type { QuantityFormat } from '../../../shared/quantity-format';
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

/** A height in metres with the locale's decimal mark, e.g. "2,31 m". */
export function height(f: QuantityFormat, v: number | null, none = '–'): string {
  return v === null ? none : `${f.fixed(v, 2)} m`;
}

/** Rows of the results table, one column per kick. */
export function figureRows(figures: readonly FlightFigures[], f: QuantityFormat): FigureRow[] {
  const row = (id: string, label: string, value: (f: FlightFigures) => string): FigureRow => ({ id, label, values: figures.map(value) });
  return [
    row('carry', 'Carry', (k) => (k.landed ? f.distance(k.carryM) : `${f.distance(k.carryM)} (still in the air after 30 s)`)),
    row('apex', 'Apex', (k) => height(f, k.apexM)),
    row('time', 'Flight time', (k) => `${f.fixed(k.flightTimeS, 2)} s`),
    row('landing', 'Landing speed', (k) => `${f.fixed(k.landingSpeedMs, 1)} m/s`),
    row('wall', `Underside at ${f.round(WALL_DISTANCE_M, 2)}`, (k) => height(f, k.wallHeightM, 'landed before')),
    row('goal', 'Top of ball at goal line', (k) => height(f, k.goalTopHeightM, 'landed before')),
    row('verdict', 'At the goal line', (k) => VERDICT_TEXT[k.goalVerdict]),
  ];
}

/** The side view in words: each kick's carry, apex and what it does at the wall and the goal. */
export function sideSummary(figures: readonly FlightFigures[], goalDistanceM: number, f: QuantityFormat): string {
  if (figures.length === 0) return 'Side view: computing the flight.';
  const wallAt = f.round(WALL_DISTANCE_M, 2);
  const parts = figures.map((k, i) => {
    const wall = k.wallHeightM === null ? `lands before ${wallAt}` : `passes ${wallAt} at ${height(f, k.wallHeightM)}`;
    return `kick ${KICK_NAMES[i]} carries ${f.distance(k.carryM)} with an apex of ${height(f, k.apexM)}, ${wall}, and is ${VERDICT_TEXT[k.goalVerdict]} at ${f.round(goalDistanceM)}`;
  });
  return `Side view of height over distance: ${parts.join('; ')}.`;
}

/** The top view in words: where each kick lands across the aim line. */
export function topSummary(flights: readonly Flight[], f: QuantityFormat): string {
  if (flights.length === 0) return 'Top view: computing the flight.';
  const parts = flights.map((flight, i) => {
    const y = flight.landing.y;
    const side = Math.abs(y) < 0.05 ? 'on the aim line' : `${f.distance(Math.abs(y))} ${y > 0 ? 'left' : 'right'} of the aim line`;
    return `kick ${KICK_NAMES[i]} lands ${f.distance(flight.landing.x)} out, ${side}`;
  });
  return `Top view: ${parts.join('; ')}.`;
}
