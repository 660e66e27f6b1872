/**
 * Synthetic phone-video tracks for the video-measurement specs, the bench and the end-to-end spec: a
 * known kick flown by an independent fixed-step RK4 (rk4-reference.ts) and filmed by a side-on camera
 * at 240 frames per second, whose frame is 1920 px wide with the whole flight across 85 % of it. The
 * projection is written out here (not taken from video-camera.ts), so the specs check the solver's
 * camera model rather than reuse it.
 */

import { BALL_SIZES } from '../../../shared/flight/constants';
import { modelFromKick } from '../../../shared/flight/model';
import { SeededRandom } from '../../../shared/flight/random';
import type { LaunchTrackInput, TrackPoint } from '../../../shared/flight/video-track';
import { rk4Reference } from './rk4-reference';

/** One filmed kick. */
export interface SyntheticTrackCase {
  speedMs: number;
  elevationDeg: number;
  backspinRps: number;
  /** Phone tilt, degrees (+ = the far end of the ground line lower on screen). */
  tiltDeg: number;
  /** Whether only the first half of the flight is tapped. */
  half: boolean;
  /** Taps, spread evenly over the tapped part of the flight. */
  taps: number;
  /** Each tap coordinate is off by a uniform amount in ±noisePx. */
  noisePx: number;
  seed: number;
}

/** A filmed kick: the solver's input, the truth, and the camera it was filmed with. */
export interface SyntheticTrack {
  input: LaunchTrackInput;
  flightTimeS: number;
  carryM: number;
  contactTimeS: number;
  /** Every frame's true ball centre while the ball is up (240 fps), for rendering a video. */
  frames: TrackPoint[];
  pxPerM: number;
}

/** Frame rate of the synthetic phone. */
export const SYNTHETIC_FPS = 240;
const FRAME_WIDTH_PX = 1920;
const KICK_SPOT_PX = { xPx: 150, yPx: 900 };

/** Film one kick and tap it. */
export function syntheticTrack(c: SyntheticTrackCase): SyntheticTrack {
  const rng = new SeededRandom(c.seed);
  const radiusM = BALL_SIZES[5].radiusM;
  const model = modelFromKick({ speed: c.speedMs, elevationDeg: c.elevationDeg, backspinRps: c.backspinRps });
  const flight = rk4Reference(model, 1 / (4 * SYNTHETIC_FPS), 1 / SYNTHETIC_FPS);
  const pxPerM = (0.85 * FRAME_WIDTH_PX) / flight.carryM;
  const tilt = (c.tiltDeg * Math.PI) / 180;
  // Side-on pinhole, image plane parallel to the kick plane: a similarity. Ground direction (cos, sin),
  // up (sin, −cos) because image y grows downward; heights are the ball centre's above the ground.
  const project = (alongM: number, heightM: number): { xPx: number; yPx: number } => ({
    xPx: KICK_SPOT_PX.xPx + pxPerM * (alongM * Math.cos(tilt) + heightM * Math.sin(tilt)),
    yPx: KICK_SPOT_PX.yPx + pxPerM * (alongM * Math.sin(tilt) - heightM * Math.cos(tilt)),
  });
  // Foot contact falls between two frames of the video's clock.
  const contactTimeS = 1 + (17 + rng.uniform()) / SYNTHETIC_FPS;
  const frames = flight.samples.map((s) => ({ tS: contactTimeS + s.t, ...project(s.x, s.z + radiusM) }));
  const endS = c.half ? flight.flightTimeS / 2 : flight.flightTimeS;
  const usable = frames.filter((f, i) => i > 0 && f.tS - contactTimeS <= endS);
  const points: TrackPoint[] = [];
  for (let k = 0; k < c.taps; k++) {
    const frame = usable[Math.round((k * (usable.length - 1)) / (c.taps - 1))]!;
    points.push({
      tS: frame.tS,
      xPx: frame.xPx + c.noisePx * (2 * rng.uniform() - 1),
      yPx: frame.yPx + c.noisePx * (2 * rng.uniform() - 1),
    });
  }
  return {
    input: { points, calibration: { a: { ...project(0, 0), alongM: 0 }, b: { ...project(flight.carryM, 0), alongM: flight.carryM } } },
    flightTimeS: flight.flightTimeS,
    carryM: flight.carryM,
    contactTimeS,
    frames,
    pxPerM,
  };
}
