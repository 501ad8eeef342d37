/**
 * A target's track across a night for the sky overlay: horizontal positions at regular times,
 * and the time ticks that fall inside a calibrated photo.
 */
import type { EquatorialJ2000, ObserverSite } from '../schemas/geometry';
import { assertFiniteInRange, assertValidDate } from '../guards';
import { MS_PER_HOUR, MS_PER_MINUTE } from '../units';
import { targetHorizontal } from '../sky';
import type { HorizontalOptions } from '../sky';
import { assertSkyDirection, type CameraPose, cameraBasis, type PixelPoint, projectWithBasis, type SkyDirection } from './camera';

/** Longest track accepted, hours. */
export const MAX_TRACK_SPAN_HOURS = 48;
/** Most samples a track may hold. */
export const MAX_TRACK_SAMPLES = 10_000;

/** A sky direction at an instant. */
export interface TimedSkyDirection extends SkyDirection {
  /** The instant, milliseconds since the Unix epoch (UTC). */
  timeMs: number;
}

/** A time tick drawn in the image. */
export interface PixelTick extends PixelPoint {
  /** The instant, milliseconds since the Unix epoch (UTC). */
  timeMs: number;
}

/**
 * Horizontal positions of a fixed J2000 target from `start` to `end` every `stepMinutes`
 * (the end is always included), for projectPolyline (./overlay) and {@link projectTicks}.
 * @param target - J2000 position (RA 0..24 h, Dec -90..90 deg)
 * @param site - observer (lat -90..90, lon -180..180 east positive, elevation -500..9000 m)
 * @param start - first instant
 * @param end - last instant, after `start` and at most 48 h later
 * @param stepMinutes - spacing, minutes 0.5..240 (default 5); at most 10 000 samples
 * @param options - refraction (default: apparent altitude, as targetHorizontal)
 * @returns samples in time order
 * @throws RangeError on invalid input
 */
export function targetTrack(
  target: EquatorialJ2000,
  site: ObserverSite,
  start: Date,
  end: Date,
  stepMinutes = 5,
  options: HorizontalOptions = {},
): TimedSkyDirection[] {
  const startMs = assertValidDate(start, 'start').getTime();
  const endMs = assertValidDate(end, 'end').getTime();
  const spanMs = endMs - startMs;
  if (!(spanMs > 0 && spanMs <= MAX_TRACK_SPAN_HOURS * MS_PER_HOUR)) {
    throw new RangeError(`end must be after start and at most ${MAX_TRACK_SPAN_HOURS} h later (got ${spanMs / MS_PER_HOUR} h)`);
  }
  const stepMs = assertFiniteInRange(stepMinutes, 'stepMinutes', 0.5, 240) * MS_PER_MINUTE;
  const count = Math.ceil(spanMs / stepMs - 1e-9) + 1;
  if (count > MAX_TRACK_SAMPLES) throw new RangeError(`a track may hold at most ${MAX_TRACK_SAMPLES} samples (got ${count})`);
  const out: TimedSkyDirection[] = [];
  for (let i = 0; i < count; i++) {
    const timeMs = Math.min(startMs + i * stepMs, endMs);
    const h = targetHorizontal(target, site, new Date(timeMs), options);
    out.push({ timeMs, azimuthDeg: h.azimuthDeg, altitudeDeg: h.altitudeDeg });
  }
  return out;
}

/**
 * The time ticks of a track that land inside the image (plus an optional margin).
 * @param pose - camera pose and image size (see cameraPoseSchema)
 * @param samples - timed sky directions (azimuth 0..360 deg, altitude -90..90 deg, finite time)
 * @param marginPx - how far outside the image a tick may lie, pixels 0..1e6 (default 0)
 * @returns the ticks in front of the camera and inside the image, in input order
 * @throws RangeError on invalid input
 */
export function projectTicks(pose: CameraPose, samples: readonly TimedSkyDirection[], marginPx = 0): PixelTick[] {
  const basis = cameraBasis(pose);
  assertFiniteInRange(marginPx, 'marginPx', 0, 1e6);
  if (!Array.isArray(samples)) throw new RangeError('samples must be an array');
  const ticks: PixelTick[] = [];
  samples.forEach((s, i) => {
    const d = assertSkyDirection(s, `samples[${i}]`);
    const timeMs = assertFiniteInRange(s.timeMs, `samples[${i}].timeMs`);
    const p = projectWithBasis(basis, d.azimuthDeg, d.altitudeDeg);
    if (p.inFront && p.x >= -marginPx && p.x <= pose.widthPx + marginPx && p.y >= -marginPx && p.y <= pose.heightPx + marginPx) {
      ticks.push({ timeMs, x: p.x, y: p.y });
    }
  });
  return ticks;
}
