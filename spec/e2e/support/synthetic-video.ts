/**
 * A synthetic side-on clip of a kick for the video-measurement e2e: frames drawn from the flight model (a
 * white ball over a pitch, two orange ground cones at known distances) and encoded to VP8 WebM by Debian's
 * ffmpeg, which Chromium plays without proprietary codecs. Installed with apt-get when missing and running
 * as root (a test machine), otherwise the spec says how to get it.
 */
import { spawn, spawnSync } from 'node:child_process';
import { planeCamera, simulateKick, type FlightConditions, type TrackCalibration } from '../../../shared/flight';

/** What to film. */
export interface SyntheticKick {
  speedMs: number;
  elevationDeg: number;
  backspinRps: number;
  conditions: FlightConditions;
  /** Moment of foot contact on the clip's clock, s. */
  contactTimeS: number;
}

/** The clip: where the ball's centre is in each frame that shows it in flight. */
export interface SyntheticClip {
  path: string;
  framesPerSecond: number;
  frameCount: number;
  /** Ball centre per frame index while in flight (after contact, before landing), video pixels. */
  ballPx: Map<number, { xPx: number; yPx: number }>;
}

/** Whether ffmpeg runs here; installs it from Debian's packages as root when it does not. */
export function ensureFfmpeg(): void {
  if (spawnSync('ffmpeg', ['-version']).status === 0) return;
  if (process.getuid?.() === 0) {
    const install = spawnSync('apt-get', ['install', '-y', '--no-install-recommends', 'ffmpeg'], {
      stdio: 'ignore',
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
    });
    if (install.status === 0 && spawnSync('ffmpeg', ['-version']).status === 0) return;
  }
  throw new Error('ffmpeg is needed to render the synthetic clip: apt-get install -y ffmpeg');
}

/** Renders the kick filmed through `calibration`'s camera into a WebM at `path`. */
export async function renderKickClip(
  path: string,
  kick: SyntheticKick,
  calibration: TrackCalibration,
  frame: { widthPx: number; heightPx: number; framesPerSecond: number; durationS: number },
): Promise<SyntheticClip> {
  ensureFfmpeg();
  const camera = planeCamera(calibration);
  const flight = simulateKick({
    ...kick.conditions,
    speed: kick.speedMs,
    elevationDeg: kick.elevationDeg,
    backspinRps: kick.backspinRps,
    path: true,
  });
  const radiusM = kick.conditions.ball?.radiusM ?? 0.11;
  const radiusPx = radiusM * camera.pxPerM;
  const { widthPx: w, heightPx: h, framesPerSecond: fps } = frame;
  const frameCount = Math.round(frame.durationS * fps);
  const ballPx = new Map<number, { xPx: number; yPx: number }>();
  const at = (tS: number) => {
    // Linear between the 20 ms path samples (sub-millimetre at these speeds for a drawing).
    const p = flight.path;
    if (tS <= 0) return { x: 0, z: 0 };
    const i = p.findIndex((q) => q.t >= tS);
    if (i <= 0) return { x: p[p.length - 1]!.x, z: 0 };
    const a = p[i - 1]!;
    const b = p[i]!;
    const s = (tS - a.t) / (b.t - a.t);
    return { x: a.x + s * (b.x - a.x), z: Math.max(0, a.z + s * (b.z - a.z)) };
  };
  const ground = (alongM: number) => camera.project({ alongM, heightM: 0 });
  const ffmpeg = spawn(
    'ffmpeg',
    ['-y', '-loglevel', 'error', '-f', 'rawvideo', '-pix_fmt', 'rgb24', '-s', `${w}x${h}`, '-r', String(fps), '-i', '-'].concat([
      '-c:v',
      'libvpx',
      '-b:v',
      '2M',
      '-deadline',
      'realtime',
      '-cpu-used',
      '8',
      '-pix_fmt',
      'yuv420p',
      path,
    ]),
    { stdio: ['pipe', 'ignore', 'pipe'] },
  );
  let stderr = '';
  ffmpeg.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  const done = new Promise<void>((resolve, reject) => {
    ffmpeg.on('error', reject);
    ffmpeg.on('close', (code) => (code === 0 ? resolve() : reject(new Error(`ffmpeg exited ${code}: ${stderr}`))));
  });
  // The ground line through the two marks; sky above it, grass below.
  const g0 = ground(0);
  const g1 = ground(1);
  const slope = (g1.yPx - g0.yPx) / (g1.xPx - g0.xPx);
  const background = Buffer.alloc(w * h * 3);
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const groundY = g0.yPx + slope * (x - g0.xPx);
      const o = 3 * (y * w + x);
      const [r, g, b] = y < groundY ? [150, 190, 225] : Math.floor(x / 80) % 2 ? [46, 125, 50] : [56, 142, 60];
      background[o] = r;
      background[o + 1] = g;
      background[o + 2] = b;
    }
  }
  const disc = (buf: Buffer, cx: number, cy: number, r: number, rgb: [number, number, number]) => {
    for (let y = Math.floor(cy - r); y <= Math.ceil(cy + r); y++) {
      for (let x = Math.floor(cx - r); x <= Math.ceil(cx + r); x++) {
        if (x < 0 || y < 0 || x >= w || y >= h || (x - cx) ** 2 + (y - cy) ** 2 > r * r) continue;
        const o = 3 * (y * w + x);
        buf[o] = rgb[0];
        buf[o + 1] = rgb[1];
        buf[o + 2] = rgb[2];
      }
    }
  };
  for (const mark of [calibration.a, calibration.b]) disc(background, mark.xPx, mark.yPx, 6, [240, 120, 20]);
  for (let n = 0; n < frameCount; n++) {
    const img = Buffer.from(background);
    const t = n / fps - kick.contactTimeS;
    const pos = at(Math.min(t, flight.flightTimeS));
    const px = camera.project({ alongM: pos.x, heightM: pos.z + radiusM });
    if (t > 0 && t < flight.flightTimeS) ballPx.set(n, px);
    disc(img, px.xPx, px.yPx, Math.max(2, radiusPx), [250, 250, 250]);
    if (!ffmpeg.stdin.write(img)) await new Promise((r) => ffmpeg.stdin.once('drain', r));
  }
  ffmpeg.stdin.end();
  await done;
  return { path, framesPerSecond: fps, frameCount, ballPx };
}
