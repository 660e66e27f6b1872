/**
 * The planner's words: the spot, a player's set-piece result and the shares as the table shows them, in
 * one place so the charts' text alternatives, the table and the headings say the same thing. Numbers follow
 * the club's locale; distances on the ground follow its distance unit, while the wall's height stays in
 * metres like the wall-height control.
 */

import { WALL_DISTANCE_M, type IntendedKick, type SetPieceShares } from '../../../shared/flight';
import type { QuantityFormat } from '../../../shared/quantity-format';
import type { PlannerSpot, RankedPlayer } from './planner-rank';

/** A share as a whole percentage in the club's locale, e.g. 0.384 → "38 %". */
export function percent(share: number, f: QuantityFormat): string {
  return f.percent(share);
}

/** Which side of the goal's centre a point across the pitch is. */
function across(xM: number, f: QuantityFormat): string {
  if (Math.abs(xM) < 0.05) return 'central';
  return `${f.distance(Math.abs(xM))} ${xM > 0 ? 'right' : 'left'} of centre`;
}

/** The spot in words: how far out and across the ball is, its distance to goal, the wall. */
export function describeSpot(spot: PlannerSpot, f: QuantityFormat): string {
  const d = Math.hypot(spot.ball.x, spot.ball.y);
  return (
    `Ball ${f.distance(spot.ball.y)} out, ${across(spot.ball.x, f)}, ${f.distance(d)} from the centre of the goal; ` +
    `wall ${f.round(WALL_DISTANCE_M, 2)} away, ${f.fixed(spot.wallHeightM, 2)} m high; aim ${spot.aimXM === 0 ? 'at the centre of the goal' : across(spot.aimXM, f)}.`
  );
}

/** Kicks short of the wall or of the goal line. */
export function shortShare(s: SetPieceShares): number {
  return s.shortOfWall + s.shortOfGoal;
}

/** A player's name as the planner shows it, e.g. "7 · Ada Lovelock". */
export function playerName(p: Pick<RankedPlayer, 'displayName' | 'shirtNumber'>): string {
  return p.shirtNumber === null ? p.displayName : `${p.shirtNumber} · ${p.displayName}`;
}

/** The goal-mouth cloud in words: what share of the player's kicks does what. */
export function describeResult(p: RankedPlayer, f: QuantityFormat): string {
  if (!p.result || !p.shares) return `${playerName(p)}: no launch profile for this technique yet.`;
  const s = p.shares;
  return (
    `${playerName(p)}, ${f.number(p.result.samples, 0)} simulated kicks: ${f.percent(s.onTarget)} in under the bar, ` +
    `${f.percent(s.over)} over the bar, ${f.percent(s.wide)} wide, ${f.percent(s.blocked)} blocked by the wall, ` +
    `${f.percent(shortShare(s))} short.`
  );
}

/** Spin in words with its rate, e.g. "3.0 rev/s topspin". */
function spinText(rps: number, positive: string, negative: string, f: QuantityFormat): string {
  if (Math.abs(rps) < 0.05) return `no ${positive}`;
  return `${f.fixed(Math.abs(rps), 1)} rev/s ${rps > 0 ? positive : negative}`;
}

/**
 * The kick a player would choose for the spot, in words: launch speed, elevation, spins and the aim-off
 * for curl, e.g. "22.8 m/s at 22°, 3.0 rev/s topspin, 4.5 rev/s curl to the left, aimed 6.7° right".
 */
export function chosenKickText(k: IntendedKick, f: QuantityFormat): string {
  const aim =
    Math.abs(k.aimOffDeg) < 0.05 ? 'aimed straight' : `aimed ${f.fixed(Math.abs(k.aimOffDeg), 1)}° ${k.aimOffDeg > 0 ? 'left' : 'right'}`;
  return (
    `${f.fixed(k.speedMs, 1)} m/s at ${f.number(k.elevationDeg, 0)}°, ${spinText(k.backspinRps, 'backspin', 'topspin', f)}, ` +
    `${spinText(k.sidespinRps, 'curl to the left', 'curl to the right', f).replace('no curl to the left', 'no curl')}, ${aim}`
  );
}
