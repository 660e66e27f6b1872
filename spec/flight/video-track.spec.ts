import { planeCamera } from '../../shared/flight/video-camera';
import { solveLaunchFromTrack, type LaunchTrackFit, type LaunchTrackResult } from '../../shared/flight/video-track';
import { syntheticTrack, type SyntheticTrackCase } from './support/synthetic-track';

// The grid: speeds 15–32 m/s, elevations 8–45°, backspin −6..10 rev/s, the phone tilted up to
// 10°, whole and half flights, 12 taps with ±2 px noise on a 1920 px frame.
const SPEEDS_MS = [15, 20, 26, 32];
const ELEVATIONS_DEG = [8, 20, 32, 45];
const BACKSPINS_RPS = [-6, 0, 4, 10];
const TILTS_DEG = [0, 10, -10];
// Targets of the issue (a coach's working accuracy, common practice).
const SPEED_TOLERANCE = 0.03;
const ELEVATION_TOLERANCE_DEG = 1.5;
const BACKSPIN_TOLERANCE_RPS = 1.5;

function gridCases(speedMs: number, half: boolean): SyntheticTrackCase[] {
  const cases: SyntheticTrackCase[] = [];
  ELEVATIONS_DEG.forEach((elevationDeg, i) =>
    BACKSPINS_RPS.forEach((backspinRps, j) =>
      cases.push({
        speedMs,
        elevationDeg,
        backspinRps,
        tiltDeg: TILTS_DEG[(i + j) % TILTS_DEG.length]!,
        half,
        taps: 12,
        noisePx: 2,
        seed: 1000 * speedMs + 10 * elevationDeg + backspinRps + (half ? 7 : 0),
      }),
    ),
  );
  return cases;
}

function solved(c: SyntheticTrackCase): { fit: LaunchTrackFit; label: string } {
  const result = solveLaunchFromTrack(syntheticTrack(c).input);
  const label = `${c.speedMs} m/s ${c.elevationDeg}° ${c.backspinRps} rev/s tilt ${c.tiltDeg}° ${c.half ? 'half' : 'whole'} flight`;
  if (!result.ok) throw new Error(`${label}: refused ${result.code}: ${result.message}`);
  return { fit: result, label };
}

function refusal(result: LaunchTrackResult): string {
  return result.ok ? 'ok' : result.code;
}

describe('video camera model (side-on pinhole: a similarity from the kick plane to the image)', () => {
  it('projects a point of the kick plane where a hand computation puts it', () => {
    // Hand computation: ground marks 20 m apart, 1,000 px apart along (960, 280) → 50 px/m, ground
    // direction e = (0.96, 0.28), up u = (0.28, −0.96). A ball centre 10 m along and 2 m up:
    // a + 50·(10·e + 2·u) = (100, 700) + (508, 44) = (608, 744).
    const camera = planeCamera({ a: { xPx: 100, yPx: 700, alongM: 0 }, b: { xPx: 1060, yPx: 980, alongM: 20 } });
    expect(camera.pxPerM).toBeCloseTo(50, 12);
    // atan(280/960) = 16.26°.
    expect(camera.tiltDeg).toBeCloseTo(16.26, 2);
    const p = camera.project({ alongM: 10, heightM: 2 });
    expect(p.xPx).toBeCloseTo(608, 9);
    expect(p.yPx).toBeCloseTo(744, 9);
    const back = camera.unproject(p);
    expect(back.alongM).toBeCloseTo(10, 9);
    expect(back.heightM).toBeCloseTo(2, 9);
  });

  it('keeps "up" pointing up the screen when the kick travels right to left, with marks that do not start at 0 m', () => {
    // Marks at 5 m (x 1500) and 25 m (x 500): 50 px/m leftward. A ball 15 m along, 3 m up:
    // x = 1500 − 50·10 = 1000, y = 800 − 50·3 = 650.
    const camera = planeCamera({ a: { xPx: 1500, yPx: 800, alongM: 5 }, b: { xPx: 500, yPx: 800, alongM: 25 } });
    const p = camera.project({ alongM: 15, heightM: 3 });
    expect(p.xPx).toBeCloseTo(1000, 9);
    expect(p.yPx).toBeCloseTo(650, 9);
    expect(camera.tiltDeg).toBeCloseTo(0, 12);
  });

  it('puts the ball at rest one radius above the kick spot (taps are centres, marks are on the ground)', () => {
    const track = syntheticTrack({ speedMs: 20, elevationDeg: 20, backspinRps: 0, tiltDeg: 0, half: false, taps: 12, noisePx: 0, seed: 1 });
    const fit = solveLaunchFromTrack(track.input);
    expect(fit.ok).toBeTrue();
    if (!fit.ok) return;
    const first = fit.pathPx[0]!;
    const spot = track.input.calibration.a;
    // Radius of a size 5 ball (IFAB Law 2 midpoint circumference 0.69 m) in pixels above the mark.
    const radiusPx = (0.69 / (2 * Math.PI)) * track.pxPerM;
    expect(first.xPx).toBeCloseTo(spot.xPx, 6);
    expect(spot.yPx - first.yPx).toBeCloseTo(radiusPx, 6);
  });
});

describe('solveLaunchFromTrack (launch speed, elevation and backspin from taps in a side-on video)', () => {
  for (const speedMs of SPEEDS_MS) {
    it(`meets the speed and elevation targets at ${speedMs} m/s, and the backspin target on most tracks`, () => {
      const cases = gridCases(speedMs, false).concat(gridCases(speedMs, true));
      const misses: string[] = [];
      for (const c of cases) {
        const { fit, label } = solved(c);
        expect(Math.abs(fit.speedMs - c.speedMs) / c.speedMs)
          .withContext(label)
          .toBeLessThan(SPEED_TOLERANCE);
        expect(Math.abs(fit.elevationDeg - c.elevationDeg))
          .withContext(label)
          .toBeLessThan(ELEVATION_TOLERANCE_DEG);
        expect(fit.rmsResidualPx).withContext(label).toBeLessThan(2.5);
        if (Math.abs(fit.backspinRps - c.backspinRps) > BACKSPIN_TOLERANCE_RPS) {
          misses.push(`${label}: ${fit.backspinRps.toFixed(2)} ± ${fit.uncertainty.backspinRps.toFixed(2)}`);
          // Where 12 taps cannot pin the spin down the fit must say so: a miss comes with a wide
          // reported spread, never as a confident wrong number.
          expect(fit.uncertainty.backspinRps).withContext(label).toBeGreaterThan(0.6);
        }
      }
      // Known limit (README, "Measuring from video"): short, low kicks, and half flights of 0.2–0.5 s,
      // leave the spin to a few pixels of bend, and the lift law flattens at high spin; 12 taps with
      // ±2 px miss 1.5 rev/s on a few of the 32 tracks per speed.
      expect(misses.length)
        .withContext(misses.join('\n'))
        .toBeLessThanOrEqual(Math.floor(0.15 * cases.length));
    });
  }

  it('reports an uncertainty that covers the error of speed and elevation', () => {
    let covered = 0;
    let total = 0;
    for (const c of gridCases(26, false).concat(gridCases(20, true))) {
      const { fit } = solved(c);
      total += 2;
      if (Math.abs(fit.speedMs - c.speedMs) <= 3 * fit.uncertainty.speedMs) covered++;
      if (Math.abs(fit.elevationDeg - c.elevationDeg) <= 3 * fit.uncertainty.elevationDeg) covered++;
    }
    // Three standard deviations cover 99.7 % of a normal error; allow the linearisation some slack.
    expect(covered / total).toBeGreaterThanOrEqual(0.9);
  });

  it('finds the moment of foot contact between two frames', () => {
    const track = syntheticTrack({ speedMs: 24, elevationDeg: 28, backspinRps: 5, tiltDeg: 4, half: false, taps: 12, noisePx: 2, seed: 9 });
    const fit = solveLaunchFromTrack(track.input);
    expect(fit.ok).toBeTrue();
    if (!fit.ok) return;
    // Within half a 240 fps frame.
    expect(Math.abs(fit.contactTimeS - track.contactTimeS)).toBeLessThan(1 / 480);
  });

  describe('refusals (stable codes)', () => {
    const base = (): ReturnType<typeof syntheticTrack> =>
      syntheticTrack({ speedMs: 22, elevationDeg: 24, backspinRps: 4, tiltDeg: 0, half: false, taps: 12, noisePx: 1, seed: 4 });

    it('refuses fewer than five taps', () => {
      const { input } = base();
      expect(refusal(solveLaunchFromTrack({ ...input, points: input.points.slice(0, 4) }))).toBe('too_few_points');
    });

    it('refuses taps whose times do not increase', () => {
      const { input } = base();
      const points = input.points.map((p) => ({ ...p }));
      points[5]!.tS = points[4]!.tS;
      expect(refusal(solveLaunchFromTrack({ ...input, points }))).toBe('times_not_increasing');
      expect(refusal(solveLaunchFromTrack({ ...input, points: input.points.slice().reverse() }))).toBe('times_not_increasing');
    });

    it('refuses ground points on top of each other, or too close in metres', () => {
      const { input } = base();
      const { a } = input.calibration;
      expect(refusal(solveLaunchFromTrack({ ...input, calibration: { a, b: { ...a, alongM: 30 } } }))).toBe('calibration_too_close');
      expect(refusal(solveLaunchFromTrack({ ...input, calibration: { a, b: { ...input.calibration.b, alongM: 1 } } }))).toBe(
        'calibration_too_close',
      );
    });

    it('refuses a ground line that leans like a phone held far from level', () => {
      const { input } = base();
      const { a } = input.calibration;
      expect(refusal(solveLaunchFromTrack({ ...input, calibration: { a, b: { xPx: a.xPx + 800, yPx: a.yPx + 700, alongM: 30 } } }))).toBe(
        'calibration_not_level',
      );
    });

    it('refuses taps that no kick can fly through', () => {
      const { input } = base();
      const zigzag = input.points.map((p, i) => ({ ...p, yPx: p.yPx + (i % 2 ? 60 : -60) }));
      expect(refusal(solveLaunchFromTrack({ ...input, points: zigzag }))).toBe('no_kick_fits');
      // The ball moving back towards the kick spot.
      const backwards = input.points.map((p, i, all) => ({ ...all[all.length - 1 - i]!, tS: p.tS }));
      expect(refusal(solveLaunchFromTrack({ ...input, points: backwards }))).toBe('no_kick_fits');
      // Ground points whose distances are three times too large: gravity no longer matches the scale.
      const { b } = input.calibration;
      expect(refusal(solveLaunchFromTrack({ ...input, calibration: { a: input.calibration.a, b: { ...b, alongM: 3 * b.alongM } } }))).toBe(
        'no_kick_fits',
      );
    });

    it('refuses speeds beyond what a kick reaches, either way', () => {
      const fast = syntheticTrack({
        speedMs: 46,
        elevationDeg: 15,
        backspinRps: 0,
        tiltDeg: 0,
        half: false,
        taps: 12,
        noisePx: 1,
        seed: 5,
      });
      expect(refusal(solveLaunchFromTrack(fast.input))).toBe('speed_out_of_range');
      const slow = syntheticTrack({
        speedMs: 4,
        elevationDeg: 40,
        backspinRps: 0,
        tiltDeg: 0,
        half: false,
        taps: 12,
        noisePx: 0.2,
        seed: 6,
      });
      // The slow ball carries under 2 m: mark a cone twice as far along the same line.
      const { a, b } = slow.input.calibration;
      const cone = { xPx: 2 * b.xPx - a.xPx, yPx: 2 * b.yPx - a.yPx, alongM: 2 * b.alongM };
      expect(refusal(solveLaunchFromTrack({ ...slow.input, calibration: { a, b: cone } }))).toBe('speed_out_of_range');
    });

    it('throws a RangeError naming the field for malformed input', () => {
      const { input } = base();
      const points = input.points.map((p) => ({ ...p }));
      points[2]!.xPx = Number.NaN;
      expect(() => solveLaunchFromTrack({ ...input, points })).toThrowError(RangeError, /points\[2\]\.xPx/);
      expect(() =>
        solveLaunchFromTrack({ ...input, calibration: { ...input.calibration, b: { ...input.calibration.b, alongM: 900 } } }),
      ).toThrowError(RangeError, /calibration\.b\.alongM/);
    });
  });
});
