/**
 * The camera model behind video measurement: a phone filming side-on, its image plane parallel to the
 * kick's vertical plane. A pinhole camera maps a plane parallel to its image plane onto the image by a
 * similarity — a uniform scale, a rotation (the phone's tilt) and a shift (Hartley & Zisserman, *Multiple
 * View Geometry in Computer Vision*, 2nd ed. 2003, §2.4 and §8.1: a plane-to-plane homography whose
 * projective part vanishes when the planes are parallel). Two marks on the ground along the kick line,
 * at known distances, fix that similarity: their pixels give the scale (px per metre), the kick's
 * direction in the image and the tilt. Image y grows downward, so "up" in the kick plane is the
 * perpendicular of the ground line that points to smaller y (a phone tilted less than 90°).
 *
 * Heights here are of the ball's centre above the ground; the calibration marks lie on the ground and
 * the taps mark the ball's centre, so the flight model's z (the centre's height above its height at
 * rest) becomes z + r before projection.
 */

/** A mark on the ground on the kick line: its pixel and its distance from the kick spot, m. */
export interface GroundMark {
  xPx: number;
  yPx: number;
  /** Distance along the kick line from the kick spot (the ball at rest), m. */
  alongM: number;
}

/** Two ground marks that fix the camera (for example the kick spot at 0 m and the target cone). */
export interface TrackCalibration {
  a: GroundMark;
  b: GroundMark;
}

/** A point of the kick plane: distance along the kick line and height above the ground, m. */
export interface PlanePoint {
  alongM: number;
  heightM: number;
}

/** A pixel, image y downward. */
export interface ImagePoint {
  xPx: number;
  yPx: number;
}

/** The similarity between the kick plane and the image, built from a calibration. */
export interface PlaneCamera {
  /** Pixels per metre in the kick plane. */
  pxPerM: number;
  /** Angle of the ground line against the image's horizontal, degrees, + = the far end lower (clockwise on screen). */
  tiltDeg: number;
  /** Pixel of a point of the kick plane. */
  project(point: PlanePoint): ImagePoint;
  /** Point of the kick plane under a pixel. */
  unproject(pixel: ImagePoint): PlanePoint;
}

/**
 * Build the plane-to-image similarity from two ground marks. The caller checks that the marks are apart
 * in pixels and in metres (`calibrationProblem`); here they only need to differ.
 */
export function planeCamera(calibration: TrackCalibration): PlaneCamera {
  const { a, b } = calibration;
  const dxPx = b.xPx - a.xPx;
  const dyPx = b.yPx - a.yPx;
  const lengthPx = Math.hypot(dxPx, dyPx);
  const dAlongM = b.alongM - a.alongM;
  if (!(lengthPx > 0) || dAlongM === 0) throw new RangeError('calibration marks must differ in pixels and in distance');
  const pxPerM = lengthPx / Math.abs(dAlongM);
  // Unit image vector of +along (towards larger distances), and of +height: the perpendicular pointing up.
  const sign = Math.sign(dAlongM);
  const ex = (sign * dxPx) / lengthPx;
  const ey = (sign * dyPx) / lengthPx;
  let ux = ey;
  let uy = -ex;
  if (uy > 0) {
    ux = -ux;
    uy = -uy;
  }
  // Tilt of the ground line on screen, whichever way the kick travels across the image.
  const tiltDeg = (Math.atan2(ex >= 0 ? ey : -ey, Math.abs(ex)) * 180) / Math.PI;
  // Determinant of [e u] (±1): the map is a rotation, or a rotation with a reflection when the kick
  // travels right to left; either way its inverse is the transpose.
  return {
    pxPerM,
    tiltDeg,
    project: ({ alongM, heightM }) => {
      const s = alongM - a.alongM;
      return { xPx: a.xPx + pxPerM * (s * ex + heightM * ux), yPx: a.yPx + pxPerM * (s * ey + heightM * uy) };
    },
    unproject: ({ xPx, yPx }) => {
      const px = (xPx - a.xPx) / pxPerM;
      const py = (yPx - a.yPx) / pxPerM;
      return { alongM: a.alongM + px * ex + py * ey, heightM: px * ux + py * uy };
    },
  };
}
