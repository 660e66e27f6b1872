/**
 * Pitch markings to scale, as pure functions returning SVG path data in metres, so every Loftline
 * diagram (set-piece planner, reach envelopes on the Player file, the sandbox) draws the same pitch from
 * one source and scales it with a `viewBox`.
 *
 * ## Pitch frame (top views)
 * Origin at the centre of the goal line being attacked. `x` runs across the pitch, + to the right as an
 * attacker faces the goal; `y` runs out from the goal line into the field (0 = goal line, the halfway line
 * at `lengthM / 2`). With the goal at the top of the screen this is SVG's own frame, so paths need no flip.
 * The goal itself lies behind the line, at negative `y`.
 *
 * The flight model's set-piece frame (`SetPieceInput`) uses `ballX` = distance out from the goal line and
 * `ballY` = + to the left as the kicker faces the goal: `ballX = y`, `ballY = −x`; see {@link toSetPieceFrame}.
 *
 * ## Goal-mouth frame (front view, looking at the goal from the field)
 * `x` as above (across, + right), SVG `y` = −height above the ground (so the drawing is upright without a
 * transform): the ground line is y = 0, the underside of the crossbar y = −2.44.
 *
 * Lines are centre lines; stroke them with {@link LINE_WIDTH_M} (or a screen-constant width) and no fill.
 */

import { GOAL_HEIGHT_M, GOAL_WIDTH_M, WALL_DISTANCE_M } from '../../../shared/flight';

/** Width of the lines, m (IFAB Laws of the Game, Law 1: lines not more than 12 cm wide). */
export const LINE_WIDTH_M = 0.12;
/** Depth of the goal area from the goal line, m (IFAB Laws of the Game, Law 1). */
export const GOAL_AREA_DEPTH_M = 5.5;
/** Width of the goal area: 5.5 m beyond each post's inside edge, 18.32 m (IFAB Laws of the Game, Law 1). */
export const GOAL_AREA_WIDTH_M = GOAL_WIDTH_M + 2 * 5.5;
/** Depth of the penalty area from the goal line, m (IFAB Laws of the Game, Law 1). */
export const PENALTY_AREA_DEPTH_M = 16.5;
/** Width of the penalty area: 16.5 m beyond each post's inside edge, 40.32 m (IFAB Laws of the Game, Law 1). */
export const PENALTY_AREA_WIDTH_M = GOAL_WIDTH_M + 2 * 16.5;
/** Distance of the penalty mark from the midpoint between the posts, m (IFAB Laws of the Game, Law 1). */
export const PENALTY_MARK_M = 11;
/** Radius of the penalty arc and the centre circle, m (IFAB Laws of the Game, Law 1). */
export const ARC_RADIUS_M = 9.15;
/** Radius of the corner arc, m (IFAB Laws of the Game, Law 1). */
export const CORNER_ARC_RADIUS_M = 1;
/** Width and depth of goalposts and crossbar, m (IFAB Laws of the Game, Law 1: the same as the lines, ≤ 12 cm). */
export const POST_WIDTH_M = 0.12;
/**
 * Default pitch: 105 × 68 m (common practice for senior pitches; IFAB Laws of the Game, Law 1 allows
 * touchlines 90–120 m and goal lines 45–90 m, 100–110 × 64–75 m in international matches).
 */
export const DEFAULT_PITCH = { lengthM: 105, widthM: 68 } as const;
/** How deep the net is drawn behind the goal line in top views, m (common practice, no standard). */
export const NET_DEPTH_M = 2;

/** A filled mark (penalty mark, centre mark) in metres. */
export interface PitchSpot {
  readonly x: number;
  readonly y: number;
  readonly r: number;
}

/** An SVG viewBox in metres. */
export interface MetreBox {
  readonly minX: number;
  readonly minY: number;
  readonly width: number;
  readonly height: number;
}

/** One drawing's markings. */
export interface PitchMarkings {
  /** Line markings as SVG path data in metres: stroke, do not fill. */
  readonly paths: readonly string[];
  /** The goal (posts and, in top views, the net outline) as SVG path data in metres: stroke. */
  readonly goal: string;
  /** Filled marks (radius 0.11 m, common practice: Law 1 gives no size). */
  readonly spots: readonly PitchSpot[];
  /** Width of the drawn region across the pitch, m. */
  readonly widthM: number;
  /** Length of the drawn region, m (top views: from the goal line; front view: height). */
  readonly lengthM: number;
  /** Region to show (a small margin around everything drawn), metres — the SVG viewBox. */
  readonly viewBox: MetreBox;
}

/** Pitch length and width for a top view. */
export interface PitchSize {
  readonly lengthM: number;
  readonly widthM: number;
}

const SPOT_R_M = 0.11;
const MARGIN_M = 1.5;

/** Numbers in path data: metres to the centimetre keep the strings short. */
function n(v: number): string {
  return String(Math.round(v * 100) / 100);
}

function rect(x0: number, y0: number, x1: number, y1: number): string {
  return `M${n(x0)} ${n(y0)}H${n(x1)}V${n(y1)}H${n(x0)}Z`;
}

/** The part of the penalty arc outside the penalty area (IFAB Laws of the Game, Law 1). */
function penaltyArc(): string {
  const dy = PENALTY_AREA_DEPTH_M - PENALTY_MARK_M;
  const dx = Math.sqrt(ARC_RADIUS_M * ARC_RADIUS_M - dy * dy);
  const r = n(ARC_RADIUS_M);
  return `M${n(-dx)} ${n(PENALTY_AREA_DEPTH_M)}A${r} ${r} 0 0 0 ${n(dx)} ${n(PENALTY_AREA_DEPTH_M)}`;
}

/** Penalty area, goal area and penalty arc: the markings every top view shares. */
function boxLines(): string[] {
  const pa = PENALTY_AREA_WIDTH_M / 2;
  const ga = GOAL_AREA_WIDTH_M / 2;
  return [`M${n(-pa)} 0V${n(PENALTY_AREA_DEPTH_M)}H${n(pa)}V0`, `M${n(-ga)} 0V${n(GOAL_AREA_DEPTH_M)}H${n(ga)}V0`, penaltyArc()];
}

/** The goal in a top view: the line between the posts' centres and the net outline behind it. */
function topGoal(): string {
  const half = GOAL_WIDTH_M / 2 + POST_WIDTH_M / 2;
  return `M${n(-half)} 0V${n(-NET_DEPTH_M)}H${n(half)}V0`;
}

/**
 * The attacking half to scale: touchlines, goal line, halfway line, half the centre circle and the centre
 * mark, corner arcs, penalty area, goal area, penalty mark and arc, and the goal.
 */
export function attackingHalfMarkings(size: PitchSize = DEFAULT_PITCH): PitchMarkings {
  const w = size.widthM / 2;
  const half = size.lengthM / 2;
  const c = n(CORNER_ARC_RADIUS_M);
  const r = n(ARC_RADIUS_M);
  const paths = [
    rect(-w, 0, w, half),
    `M${n(-ARC_RADIUS_M)} ${n(half)}A${r} ${r} 0 0 1 ${n(ARC_RADIUS_M)} ${n(half)}`,
    `M${n(-w + CORNER_ARC_RADIUS_M)} 0A${c} ${c} 0 0 1 ${n(-w)} ${c}`,
    `M${n(w - CORNER_ARC_RADIUS_M)} 0A${c} ${c} 0 0 0 ${n(w)} ${c}`,
    ...boxLines(),
  ];
  return {
    paths,
    goal: topGoal(),
    spots: [
      { x: 0, y: PENALTY_MARK_M, r: SPOT_R_M },
      { x: 0, y: half, r: SPOT_R_M },
    ],
    widthM: size.widthM,
    lengthM: half,
    viewBox: {
      minX: -w - MARGIN_M,
      minY: -NET_DEPTH_M - MARGIN_M,
      width: size.widthM + 2 * MARGIN_M,
      height: half + NET_DEPTH_M + 2 * MARGIN_M,
    },
  };
}

/**
 * The penalty area and its surroundings out to `depthM` from the goal line (default 35 m, where most
 * direct free kicks are taken), cropped to the penalty area's width plus a margin; for phone-sized views.
 */
export function penaltyAreaMarkings(depthM = 35, size: PitchSize = DEFAULT_PITCH): PitchMarkings {
  const w = Math.min(size.widthM / 2, PENALTY_AREA_WIDTH_M / 2 + 6);
  const paths = [`M${n(-w)} 0H${n(w)}`, ...boxLines()];
  if (w >= size.widthM / 2) paths.push(`M${n(-w)} 0V${n(depthM)}M${n(w)} 0V${n(depthM)}`);
  return {
    paths,
    goal: topGoal(),
    spots: [{ x: 0, y: PENALTY_MARK_M, r: SPOT_R_M }],
    widthM: 2 * w,
    lengthM: depthM,
    viewBox: { minX: -w - MARGIN_M, minY: -NET_DEPTH_M - MARGIN_M, width: 2 * w + 2 * MARGIN_M, height: depthM + NET_DEPTH_M + MARGIN_M },
  };
}

/**
 * The goal seen from the field (goal-mouth frame: SVG y = −height): ground line, posts and crossbar
 * drawn outside the 7.32 × 2.44 m opening (IFAB Laws of the Game, Law 1: measured between the inside
 * edges), with `marginM` of ground either side and `headroomM` of air above the bar.
 */
export function goalMouthMarkings(marginM = 2, headroomM = 0.6): PitchMarkings {
  const half = GOAL_WIDTH_M / 2;
  const p = POST_WIDTH_M;
  const left = -half - marginM;
  const right = half + marginM;
  const goal =
    rect(-half - p, -GOAL_HEIGHT_M - p, -half, 0) +
    rect(half, -GOAL_HEIGHT_M - p, half + p, 0) +
    rect(-half, -GOAL_HEIGHT_M - p, half, -GOAL_HEIGHT_M);
  const top = GOAL_HEIGHT_M + p + headroomM;
  return {
    paths: [`M${n(left)} 0H${n(right)}`],
    goal,
    spots: [],
    widthM: right - left,
    lengthM: GOAL_HEIGHT_M + p,
    viewBox: { minX: left, minY: -top, width: right - left, height: top + 0.3 },
  };
}

/** A point in the pitch frame, metres. */
export interface PitchPoint {
  readonly x: number;
  readonly y: number;
}

/** Pitch-frame point → the flight model's set-piece frame (`ballX` out from the line, `ballY` + = left). */
export function toSetPieceFrame(p: PitchPoint): { ballX: number; ballY: number } {
  return { ballX: p.y, ballY: p.x === 0 ? 0 : -p.x };
}

/**
 * Where a defending wall stands for a free kick at `ball`: 9.15 m from the ball (IFAB Laws of the Game,
 * Law 13) on the line from the ball to the centre of the goal, square to that line. Returns the wall's
 * centre and the unit vector along it, so a caller can draw a wall of any width.
 */
export function wallPlacement(ball: PitchPoint): { centre: PitchPoint; along: PitchPoint; distanceToGoalM: number } {
  const d = Math.hypot(ball.x, ball.y);
  const ux = d === 0 ? 0 : -ball.x / d;
  const uy = d === 0 ? -1 : -ball.y / d;
  return {
    centre: { x: ball.x + WALL_DISTANCE_M * ux, y: ball.y + WALL_DISTANCE_M * uy },
    along: { x: -uy, y: ux },
    distanceToGoalM: d,
  };
}

/** `viewBox` attribute text for a {@link MetreBox}. */
export function viewBoxAttr(box: MetreBox): string {
  return `${n(box.minX)} ${n(box.minY)} ${n(box.width)} ${n(box.height)}`;
}
