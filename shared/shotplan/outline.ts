/**
 * The outline of one level frame on the sky, and the azimuth unwrapping a flat azimuth/altitude
 * sketch needs to draw frames, paths and grids that cross north.
 *
 * A frame is the rectilinear, level camera of shared/projection (pinhole model, Hartley &
 * Zisserman ch. 6): its edge is traced by sending points along the image border back to the sky
 * with pixelToSky, so the outline bows as a real frame does (keystone away from the horizon).
 */
import { assertFiniteInRange, assertIntegerInRange } from '../guards';
import { assertSkyDirection, MAX_HORIZONTAL_FOV_DEG, MIN_HORIZONTAL_FOV_DEG, pixelToSky, type SkyDirection } from '../projection/camera';
import { RAD_PER_DEG } from '../units';

/** Image width used to trace outlines, pixels (any value gives the same directions). */
const OUTLINE_WIDTH_PX = 1000;

/**
 * The sky directions along the edge of a level frame, going round its border once (top-left,
 * top-right, bottom-right, bottom-left), `samplesPerEdge` points an edge.
 * @param pointing - where the optical axis points: true azimuth 0..360 deg, altitude -90..90 deg
 * @param fov - the frame's horizontal and vertical angles as held, degrees 1..179 each
 * @param samplesPerEdge - points per edge, integer 1..200 (default 8)
 * @returns 4 x samplesPerEdge directions (azimuth [0, 360), altitude -90..90), a closed loop
 * @throws RangeError on invalid input
 */
export function frameOutlineDirections(
  pointing: SkyDirection,
  fov: { horizontalDeg: number; verticalDeg: number },
  samplesPerEdge = 8,
): SkyDirection[] {
  const p = assertSkyDirection(pointing, 'pointing');
  const h = assertFiniteInRange(fov?.horizontalDeg, 'fov.horizontalDeg', MIN_HORIZONTAL_FOV_DEG, MAX_HORIZONTAL_FOV_DEG);
  const v = assertFiniteInRange(fov?.verticalDeg, 'fov.verticalDeg', MIN_HORIZONTAL_FOV_DEG, MAX_HORIZONTAL_FOV_DEG);
  assertIntegerInRange(samplesPerEdge, 'samplesPerEdge', 1, 200);
  // Square pixels: tan(v/2) / tan(h/2) = height / width.
  const widthPx = OUTLINE_WIDTH_PX;
  const heightPx = (widthPx * Math.tan((v / 2) * RAD_PER_DEG)) / Math.tan((h / 2) * RAD_PER_DEG);
  const pose = { azimuthDeg: p.azimuthDeg, altitudeDeg: p.altitudeDeg, rollDeg: 0, horizontalFovDeg: h, widthPx, heightPx };
  const corners: Array<[number, number]> = [[0, 0], [widthPx, 0], [widthPx, heightPx], [0, heightPx]];
  const out: SkyDirection[] = [];
  for (let edge = 0; edge < 4; edge++) {
    const [x0, y0] = corners[edge] as [number, number];
    const [x1, y1] = corners[(edge + 1) % 4] as [number, number];
    for (let i = 0; i < samplesPerEdge; i++) {
      const k = i / samplesPerEdge;
      out.push(pixelToSky(pose, { x: x0 + (x1 - x0) * k, y: y0 + (y1 - y0) * k }));
    }
  }
  return out;
}

/**
 * An azimuth as a continuous value near a reference, for flat sketches: the value congruent to
 * `azimuthDeg` (mod 360) within 180 deg of `aroundDeg`, so that a path crossing north stays
 * unbroken (e.g. 350 and 10 around 0 give -10 and 10).
 * @param azimuthDeg - azimuth, degrees (any finite value)
 * @param aroundDeg - the reference azimuth, degrees (any finite value)
 * @returns azimuthDeg + 360 k in [aroundDeg - 180, aroundDeg + 180)
 * @throws RangeError on a non-finite input
 */
export function unwrapAzimuthDeg(azimuthDeg: number, aroundDeg: number): number {
  const a = assertFiniteInRange(azimuthDeg, 'azimuthDeg');
  const c = assertFiniteInRange(aroundDeg, 'aroundDeg');
  const d = a - c;
  return c + d - 360 * Math.floor((d + 180) / 360);
}

/**
 * A sequence of azimuths made continuous: each value is moved by a multiple of 360 deg to lie
 * within 180 deg of the one before it (the first within 180 deg of `aroundDeg`), as when an
 * outline or a path is drawn on a flat azimuth axis.
 * @param azimuthsDeg - azimuths in order, degrees (finite), at most 100 000
 * @param aroundDeg - where the first is placed near, degrees (finite)
 * @returns the continuous azimuths, same length
 * @throws RangeError on invalid input
 */
export function unwrapAzimuthSequence(azimuthsDeg: readonly number[], aroundDeg: number): number[] {
  if (!Array.isArray(azimuthsDeg)) throw new RangeError('azimuthsDeg must be an array');
  if (azimuthsDeg.length > 100_000) throw new RangeError(`azimuthsDeg may hold at most 100000 values (got ${azimuthsDeg.length})`);
  const out: number[] = [];
  let previous = assertFiniteInRange(aroundDeg, 'aroundDeg');
  azimuthsDeg.forEach((a, i) => {
    const value = unwrapAzimuthDeg(assertFiniteInRange(a, `azimuthsDeg[${i}]`), previous);
    out.push(value);
    previous = value;
  });
  return out;
}
