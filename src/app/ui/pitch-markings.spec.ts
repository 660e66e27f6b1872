import { GOAL_HEIGHT_M, GOAL_WIDTH_M, WALL_DISTANCE_M } from '../../../shared/flight';
import {
  ARC_RADIUS_M,
  PENALTY_MARK_M,
  attackingHalfMarkings,
  goalMouthMarkings,
  penaltyAreaMarkings,
  toSetPieceFrame,
  wallPlacement,
} from './pitch-markings';

/** Every number in a path's data, in order. */
function numbers(path: string): number[] {
  return (path.match(/-?\d+(\.\d+)?/g) ?? []).map(Number);
}

describe('pitch markings', () => {
  const half = attackingHalfMarkings();

  it('draws the penalty area 40.32 m wide and 16.5 m deep, the goal area 18.32 × 5.5 m', () => {
    // IFAB Laws of the Game, Law 1.
    expect(half.paths).toContain('M-20.16 0V16.5H20.16V0');
    expect(half.paths).toContain('M-9.16 0V5.5H9.16V0');
  });

  it('puts the penalty mark 11 m out and the arc 9.15 m from it, outside the area only', () => {
    // IFAB Laws of the Game, Law 1: penalty mark 11 m, arc radius 9.15 m.
    expect(half.spots[0]).toEqual(jasmine.objectContaining({ x: 0, y: PENALTY_MARK_M }));
    const arc = half.paths.find((p) => p.includes(' 16.5A9.15'))!;
    const [x0, y0, , , , , , x1, y1] = numbers(arc);
    for (const [x, y] of [
      [x0!, y0!],
      [x1!, y1!],
    ]) {
      expect(y).toBe(16.5);
      expect(Math.hypot(x, y - PENALTY_MARK_M)).toBeCloseTo(ARC_RADIUS_M, 1);
    }
  });

  it('covers the attacking half of a 105 × 68 m pitch with the halfway line 52.5 m out', () => {
    expect(half.widthM).toBe(68);
    expect(half.lengthM).toBe(52.5);
    expect(half.paths[0]).toBe('M-34 0H34V52.5H-34Z');
    expect(half.viewBox.width).toBeGreaterThan(68);
  });

  it('draws the goal 7.32 m between the posts behind the line in the top views', () => {
    // IFAB Laws of the Game, Law 1: 7.32 m between the inside edges of the posts (drawn on the posts' centres).
    const [x0, , , x1] = numbers(half.goal);
    expect(x1! - x0!).toBeCloseTo(GOAL_WIDTH_M + 0.12, 2);
    expect(penaltyAreaMarkings().goal).toBe(half.goal);
  });

  it('draws the goal mouth 7.32 × 2.44 m inside the frame', () => {
    const mouth = goalMouthMarkings();
    // IFAB Laws of the Game, Law 1: 7.32 × 2.44 m.
    expect(mouth.goal).toContain(`H${GOAL_WIDTH_M / 2}V-${GOAL_HEIGHT_M}`);
    expect(mouth.viewBox.minY).toBeLessThan(-GOAL_HEIGHT_M);
  });
});

describe('wallPlacement', () => {
  it('stands the wall 9.15 m from the ball on the line to the centre of the goal, square to it', () => {
    const ball = { x: -8, y: 20 };
    const { centre, along } = wallPlacement(ball);
    // IFAB Laws of the Game, Law 13.
    expect(Math.hypot(centre.x - ball.x, centre.y - ball.y)).toBeCloseTo(WALL_DISTANCE_M, 9);
    // The centre lies on the ball–goal line: the cross product with the ball vector vanishes.
    expect(centre.x * ball.y - centre.y * ball.x).toBeCloseTo(0, 9);
    // Square to the line.
    expect(along.x * ball.x + along.y * ball.y).toBeCloseTo(0, 9);
  });

  it('maps the pitch frame to the flight model’s set-piece frame (+ = left as the kicker faces goal)', () => {
    expect(toSetPieceFrame({ x: -6, y: 22 })).toEqual({ ballX: 22, ballY: 6 });
    expect(toSetPieceFrame({ x: 0, y: 18 })).toEqual({ ballX: 18, ballY: 0 });
  });
});
