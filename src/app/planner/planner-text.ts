/**
 * The planner's words: the spot, a player's set-piece result and the shares as the table shows them, in
 * one place so the charts' text alternatives, the table and the headings say the same thing.
 */

import { WALL_DISTANCE_M, type IntendedKick, type SetPieceShares } from '../../../shared/flight';
import type { PlannerSpot, RankedPlayer } from './planner-rank';

/** A share as a whole percentage, e.g. 0.384 → "38 %". */
export function percent(share: number): string {
  return `${Math.round(share * 100)} %`;
}

/** Which side of the goal's centre a point across the pitch is. */
function across(xM: number): string {
  if (Math.abs(xM) < 0.05) return 'central';
  return `${Math.abs(xM).toFixed(1)} m ${xM > 0 ? 'right' : 'left'} of centre`;
}

/** The spot in words: how far out and across the ball is, its distance to goal, the wall. */
export function describeSpot(spot: PlannerSpot): string {
  const d = Math.hypot(spot.ball.x, spot.ball.y);
  return (
    `Ball ${spot.ball.y.toFixed(1)} m out, ${across(spot.ball.x)}, ${d.toFixed(1)} m from the centre of the goal; ` +
    `wall ${WALL_DISTANCE_M} m away, ${spot.wallHeightM.toFixed(2)} m high; aim ${spot.aimXM === 0 ? 'at the centre of the goal' : across(spot.aimXM)}.`
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
export function describeResult(p: RankedPlayer): string {
  if (!p.result || !p.shares) return `${playerName(p)}: no launch profile for this technique yet.`;
  const s = p.shares;
  return (
    `${playerName(p)}, ${p.result.samples} simulated kicks: ${percent(s.onTarget)} in under the bar, ` +
    `${percent(s.over)} over the bar, ${percent(s.wide)} wide, ${percent(s.blocked)} blocked by the wall, ` +
    `${percent(shortShare(s))} short.`
  );
}

/** Spin in words with its rate, e.g. "3.0 rev/s topspin". */
function spinText(rps: number, positive: string, negative: string): string {
  if (Math.abs(rps) < 0.05) return `no ${positive}`;
  return `${Math.abs(rps).toFixed(1)} rev/s ${rps > 0 ? positive : negative}`;
}

/**
 * The kick a player would choose for the spot, in words: launch speed, elevation, spins and the aim-off
 * for curl, e.g. "22.8 m/s at 22°, 3.0 rev/s topspin, 4.5 rev/s curl to the left, aimed 6.7° right".
 */
export function chosenKickText(k: IntendedKick): string {
  const aim =
    Math.abs(k.aimOffDeg) < 0.05 ? 'aimed straight' : `aimed ${Math.abs(k.aimOffDeg).toFixed(1)}° ${k.aimOffDeg > 0 ? 'left' : 'right'}`;
  return (
    `${k.speedMs.toFixed(1)} m/s at ${Math.round(k.elevationDeg)}°, ${spinText(k.backspinRps, 'backspin', 'topspin')}, ` +
    `${spinText(k.sidespinRps, 'curl to the left', 'curl to the right').replace('no curl to the left', 'no curl')}, ${aim}`
  );
}
