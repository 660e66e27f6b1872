/**
 * The kick a player would choose for a free kick: the intended launch speed, elevation, backspin and
 * sidespin (within their speed ceiling and their technique's range) that maximise their own share on
 * target over the wall, with the aim-off for curl that brings the intended ball to the aim point. Their
 * fitted spreads (speed offset, aim, elevation and spin) then scatter the real kicks around it.
 *
 * Why: a profile describes how a player kicks, not one fixed ball. Flying the ball they happened to drill
 * at 30 m over a wall 9 m away ranks takers by the geometry of their drills, not their skill.
 *
 * Method (a sample-average approximation, solved by grid search then compass search):
 * 1. Common random numbers: one seeded set of the player's launch deviations is drawn once, so every
 *    candidate kick is judged on the same draws and the objective is a deterministic function.
 * 2. Coarse grid over elevation × backspin × sidespin in the technique's range. For each, the noise-free
 *    ball is aimed off for curl, and bisection on the launch speed finds the slowest ball that clears
 *    the wall and the fastest that stays under the bar; two speeds inside that window (or the best
 *    compromise when there is none) are scored on 24 draws.
 * 3. Compass (pattern) search from the best grid point over ln speed, elevation, backspin and sidespin on
 *    96 draws (at most 24 polls): poll ± each coordinate, move on improvement, halve the steps otherwise (Kolda, Lewis &
 *    Torczon 2003, SIAM Review 45:385, from memory).
 * The reported share is then computed on an independent draw (the caller's seed), so the choice is not
 * scored on the same noise it was tuned to (that would flatter every player).
 */

import { softMinLog } from './aimed-speed';
import { GOAL_HEIGHT_M, GOAL_WIDTH_M } from './constants';
import { DEFAULT_SOLVER_SETTINGS, integrateFlight, type VerticalPlane } from './integrate';
import { buildModel, type resolveConditions } from './model';
import type { KickProfile } from './profile-types';
import { drawLaunchNoise, predictiveSpeedLogSd, speedCapOf, type LaunchNoise, type SampledLaunch } from './sampling';
import type { Technique } from './types';

const DEG = Math.PI / 180;
/** Highest launch speed any sample may take, m/s (the flight model's inverse range). */
const MAX_SPEED_MS = 60;
/** Slowest intended ball the search considers, m/s. */
const MIN_SPEED_MS = 6;
const COARSE_SAMPLES = 24;
const REFINE_SAMPLES = 96;
const REFINE_MAX_EVALUATIONS = 24;
const REFINE_HALVINGS = 3;
const BISECTION_STEPS = 7;

/** The kick a player intends: what the search chooses, before their own spreads act on it. */
export interface IntendedKick {
  /** Intended launch speed, m/s (the delivered one is capped by the ceiling and scattered by the speed spread). */
  speedMs: number;
  elevationDeg: number;
  backspinRps: number;
  sidespinRps: number;
  /** Launch direction relative to the aim line that brings the intended ball to the aim point (curl aim-off), + = left. */
  aimOffDeg: number;
}

/** The choices a technique allows: intended elevation and spin ranges, [min, max]. */
export interface KickChoiceRange {
  elevationDeg: readonly [number, number];
  backspinRps: readonly [number, number];
  sidespinRps: readonly [number, number];
}

/**
 * What each technique allows a player to choose at a free kick (common coaching practice, no source):
 * a driven ball is struck low with little or top spin, a curled one rises to clear the wall with strong
 * sidespin (8–17 rev/s total spin are measured on free kicks, Barber & Carré 2010, Sports Engineering
 * 13:47, so up to 10 rev/s of sidespin is within reach), lofted and chipped balls go higher with backspin.
 */
export const TECHNIQUE_CHOICES: Readonly<Record<Technique, KickChoiceRange>> = {
  driven: { elevationDeg: [6, 22], backspinRps: [-4, 2], sidespinRps: [-3, 3] },
  curled: { elevationDeg: [10, 28], backspinRps: [-3, 3], sidespinRps: [2, 10] },
  lofted: { elevationDeg: [18, 40], backspinRps: [0, 8], sidespinRps: [-3, 3] },
  chipped: { elevationDeg: [30, 55], backspinRps: [2, 10], sidespinRps: [-3, 3] },
};

const widen = ([lo, hi]: readonly [number, number], v: number): [number, number] => [Math.min(lo, v), Math.max(hi, v)];

/**
 * The player's own range: the technique's, widened to include what they usually do. A curler keeps their
 * curl direction (the sign of their logged sidespin; both when they log none).
 */
export function choiceRangeOf(p: KickProfile): KickChoiceRange {
  const t = TECHNIQUE_CHOICES[p.technique];
  let side: [number, number] = [t.sidespinRps[0], t.sidespinRps[1]];
  if (p.technique === 'curled') {
    if (p.sidespinRps < 0) side = [-t.sidespinRps[1], -t.sidespinRps[0]];
    else if (p.sidespinRps === 0) side = [-t.sidespinRps[1], t.sidespinRps[1]];
  }
  return {
    elevationDeg: widen(t.elevationDeg, p.elevationDeg),
    backspinRps: widen(t.backspinRps, p.backspinRps),
    sidespinRps: widen(side, p.sidespinRps),
  };
}

/** How a flown sample ended at the wall and goal line. */
export const SAMPLE_OUTCOME = { onTarget: 0, blocked: 1, shortOfWall: 2, shortOfGoal: 3, wide: 4, over: 5 } as const;
/** One of the SAMPLE_OUTCOME codes. */
export type SampleOutcome = (typeof SAMPLE_OUTCOME)[keyof typeof SAMPLE_OUTCOME];

/** One flown sample: its outcome and where it met the wall and goal line (heights of the underside, m; goal-frame y). */
export interface FlownSample {
  outcome: SampleOutcome;
  wallZ: number | null;
  goalZ: number | null;
  goalY: number | null;
}

/** The free kick's geometry and conditions, as set-piece.ts resolves them. */
export interface SetPieceScene {
  ballY: number;
  aimYM: number;
  /** Aim direction in the goal frame, rad. */
  phi: number;
  planes: VerticalPlane[];
  wallHeightM: number;
  conditions: ReturnType<typeof resolveConditions>;
}

/** Fly one launch at the wall and goal line and classify it. */
export function flySample(scene: SetPieceScene, launch: SampledLaunch): FlownSample {
  const r = scene.conditions.radiusM;
  const f = integrateFlight(buildModel(scene.conditions, launch), {
    planes: scene.planes,
    settings: DEFAULT_SOLVER_SETTINGS,
    stopAfterPlanes: true,
  });
  let wall = null;
  let goal = null;
  for (const c of f.generalCrossings) {
    if (c.plane === 0) wall = c;
    else if (c.plane === 1) goal = c;
  }
  if (!wall) return { outcome: SAMPLE_OUTCOME.shortOfWall, wallZ: null, goalZ: null, goalY: null };
  if (wall.z <= scene.wallHeightM) return { outcome: SAMPLE_OUTCOME.blocked, wallZ: wall.z, goalZ: null, goalY: null };
  if (!goal) return { outcome: SAMPLE_OUTCOME.shortOfGoal, wallZ: wall.z, goalZ: null, goalY: null };
  const y = scene.ballY + goal.x * Math.sin(scene.phi) + goal.y * Math.cos(scene.phi);
  let outcome: SampleOutcome = SAMPLE_OUTCOME.onTarget;
  if (Math.abs(y) + r >= GOAL_WIDTH_M / 2) outcome = SAMPLE_OUTCOME.wide;
  else if (goal.z + 2 * r >= GOAL_HEIGHT_M) outcome = SAMPLE_OUTCOME.over;
  return { outcome, wallZ: wall.z, goalZ: goal.z, goalY: y };
}

function clamp(v: number, lo: number, hi: number): number {
  return v < lo ? lo : v > hi ? hi : v;
}

/**
 * The launches a player delivers when intending `kick`: speed as the aimed-speed model has it (intended,
 * capped smoothly by the sample's ceiling from its one-sided posterior, times the fitted offset and spread,
 * never beyond the physiological cap), the aim-off plus their aim bias and spread, and elevation and spins
 * scattered by the profile's spreads (the launch uncertainty of the fit) around the intended values.
 */
export function deliveredLaunches(p: KickProfile, kick: IntendedKick, noises: readonly LaunchNoise[]): SampledLaunch[] {
  const a = p.aimedSpeed;
  const sdLog = predictiveSpeedLogSd(p);
  const lnIntended = Math.log(kick.speedMs);
  const lnCap = Math.log(Math.min(MAX_SPEED_MS, speedCapOf(p)));
  return noises.map((n) => {
    const lnSpeed = Math.min(lnCap, softMinLog(lnIntended, n.lnCeiling) + a.offsetLogMean + sdLog * n.zSpeed);
    return {
      speed: Math.exp(lnSpeed),
      elevationDeg: clamp(kick.elevationDeg + (n.launch.elevationDeg - p.elevationDeg), 0.5, 89.5),
      azimuthDeg: clamp(kick.aimOffDeg + n.launch.azimuthDeg, -45, 45),
      backspinRps: clamp(kick.backspinRps + (n.launch.backspinRps - p.backspinRps), -30, 30),
      sidespinRps: clamp(kick.sidespinRps + (n.launch.sidespinRps - p.sidespinRps), -30, 30),
    };
  });
}

/** The search's answer: the chosen kick and how much work it took. */
export interface KickChoice {
  kick: IntendedKick;
  /** On-target share of the chosen kick on the search's own draws (optimistic; the check reports an independent one). */
  searchShare: number;
  /** Forward simulations spent. */
  flights: number;
}

/** A point of the search: ln intended speed, elevation, backspin, sidespin. */
type Point = [number, number, number, number];

class ChoiceSearch {
  flights = 0;
  private readonly r: number;
  private readonly lnCeiling: number;

  constructor(
    private readonly scene: SetPieceScene,
    private readonly p: KickProfile,
    private readonly range: KickChoiceRange,
    private readonly noises: readonly LaunchNoise[],
  ) {
    this.r = scene.conditions.radiusM;
    this.lnCeiling = Math.log(Math.min(MAX_SPEED_MS, speedCapOf(p), p.aimedSpeed.ceilingMs));
  }

  /** Fly the noise-free intended ball (azimuth `aimOffDeg`). */
  private nominal(speed: number, el: number, back: number, side: number, aimOffDeg: number): FlownSample {
    this.flights++;
    return flySample(this.scene, { speed, elevationDeg: el, azimuthDeg: aimOffDeg, backspinRps: back, sidespinRps: side });
  }

  /** Aim-off that brings the noise-free ball to the aim point: minus the angle at which it crosses the goal line (or lands). */
  aimOffDeg(speed: number, el: number, back: number, side: number): number {
    this.flights++;
    const f = integrateFlight(
      buildModel(this.scene.conditions, { speed, elevationDeg: el, azimuthDeg: 0, backspinRps: back, sidespinRps: side }),
      { planes: this.scene.planes, settings: DEFAULT_SOLVER_SETTINGS, stopAfterPlanes: true },
    );
    const goal = f.generalCrossings.find((c) => c.plane === 1);
    const x = goal ? goal.x : f.landing.x;
    const y = goal ? goal.y : f.landing.y;
    return x > 0 ? clamp(-Math.atan2(y, x) / DEG, -30, 30) : 0;
  }

  /** Smallest ln speed in [lo, hi] for which `ok` holds (ok monotone rising in speed), or null. */
  private lowestWhere(ok: (lnV: number) => boolean, lo: number, hi: number): number | null {
    if (!ok(hi)) return null;
    if (ok(lo)) return lo;
    for (let i = 0; i < BISECTION_STEPS; i++) {
      const mid = 0.5 * (lo + hi);
      if (ok(mid)) hi = mid;
      else lo = mid;
    }
    return hi;
  }

  /** Candidate ln speeds for one elevation and spin: inside the window between clearing the wall and staying under the bar. */
  candidateSpeeds(el: number, back: number, side: number): number[] {
    const lnMin = Math.log(MIN_SPEED_MS);
    const lnMax = this.lnCeiling;
    const aim = this.aimOffDeg(Math.exp(0.5 * (lnMin + lnMax)), el, back, side);
    const bar = GOAL_HEIGHT_M - 2 * this.r;
    const clears = (lnV: number): boolean => {
      const s = this.nominal(Math.exp(lnV), el, back, side, aim);
      return s.wallZ !== null && s.wallZ > this.scene.wallHeightM && s.goalZ !== null;
    };
    const over = (lnV: number): boolean => {
      const s = this.nominal(Math.exp(lnV), el, back, side, aim);
      return s.goalZ !== null && s.goalZ >= bar;
    };
    const lo = this.lowestWhere(clears, lnMin, lnMax);
    if (lo === null) return [lnMax];
    const overFrom = this.lowestWhere(over, lnMin, lnMax);
    const hi = overFrom === null ? lnMax : overFrom;
    if (hi <= lo) return [0.5 * (lo + hi)];
    return [1 / 3, 2 / 3].map((f) => lo + f * (hi - lo));
  }

  /** On-target count of the intended kick at `x` on the first `n` draws. */
  score(x: Point, n: number): { hits: number; kick: IntendedKick } {
    const [lnV, el, back, side] = x;
    const speed = Math.exp(lnV);
    const kick: IntendedKick = {
      speedMs: speed,
      elevationDeg: el,
      backspinRps: back,
      sidespinRps: side,
      aimOffDeg: this.aimOffDeg(speed, el, back, side),
    };
    let hits = 0;
    for (const launch of deliveredLaunches(this.p, kick, this.noises.slice(0, n))) {
      this.flights++;
      if (flySample(this.scene, launch).outcome === SAMPLE_OUTCOME.onTarget) hits++;
    }
    return { hits, kick };
  }

  /** Keep a point inside the player's range and under their ceiling. */
  clampPoint(x: Point): Point {
    const g = this.range;
    return [
      clamp(x[0], Math.log(MIN_SPEED_MS), this.lnCeiling),
      clamp(x[1], g.elevationDeg[0], g.elevationDeg[1]),
      clamp(x[2], g.backspinRps[0], g.backspinRps[1]),
      clamp(x[3], g.sidespinRps[0], g.sidespinRps[1]),
    ];
  }
}

const levels = ([lo, hi]: readonly [number, number], n: number): number[] =>
  hi - lo < 1e-9 ? [lo] : Array.from({ length: n }, (_, i) => lo + ((hi - lo) * i) / (n - 1));

/** Seed of the search's own draws, kept apart from the seed the reported share is drawn with. */
export function searchSeedOf(seed: number): number {
  return (seed * 2654435761 + 97) % 2147483647;
}

/** Choose the kick that maximises the player's on-target share at this free kick (see the header for the method). */
export function chooseKick(scene: SetPieceScene, p: KickProfile, seed: number): KickChoice {
  const range = choiceRangeOf(p);
  const noises = drawLaunchNoise(p, REFINE_SAMPLES, searchSeedOf(seed));
  const search = new ChoiceSearch(scene, p, range, noises);
  // 1. Coarse grid on the first draws.
  let best: { x: Point; hits: number } | null = null;
  for (const el of levels(range.elevationDeg, 4)) {
    for (const back of levels(range.backspinRps, 3)) {
      for (const side of levels(range.sidespinRps, 3)) {
        for (const lnV of search.candidateSpeeds(el, back, side)) {
          const x: Point = [lnV, el, back, side];
          const { hits } = search.score(x, COARSE_SAMPLES);
          if (!best || hits > best.hits) best = { x, hits };
        }
      }
    }
  }
  // 2. Compass search on all the search's draws from the best grid point.
  let x = best!.x;
  let current = search.score(x, REFINE_SAMPLES);
  const steps = [0.04, (range.elevationDeg[1] - range.elevationDeg[0]) / 8, 1.5, 1.5];
  let evaluations = 1;
  let halvings = 0;
  while (halvings <= REFINE_HALVINGS && evaluations < REFINE_MAX_EVALUATIONS) {
    let moved = false;
    for (let i = 0; i < 4 && !moved && evaluations < REFINE_MAX_EVALUATIONS; i++) {
      for (const sign of [1, -1]) {
        const trial: Point = [x[0], x[1], x[2], x[3]];
        trial[i] = trial[i]! + sign * steps[i]!;
        const clamped = search.clampPoint(trial);
        if (clamped[i] === x[i]) continue;
        evaluations++;
        const s = search.score(clamped, REFINE_SAMPLES);
        if (s.hits > current.hits) {
          x = clamped;
          current = s;
          moved = true;
          break;
        }
        if (evaluations >= REFINE_MAX_EVALUATIONS) break;
      }
    }
    if (!moved) {
      for (let i = 0; i < 4; i++) steps[i] = steps[i]! / 2;
      halvings++;
    }
  }
  return { kick: current.kick, searchShare: current.hits / REFINE_SAMPLES, flights: search.flights };
}
