import { describe, expect, it } from 'vitest';
import { type CameraPose } from '../../../shared/projection/camera';
import { projectTicks, targetTrack } from '../../../shared/projection/track';
import { GALACTIC_CENTRE_J2000, targetHorizontal } from '../../../shared/sky';

const site = { lat: -33.9, lon: 151.2, elevationM: 20 };
const start = new Date('2026-06-15T08:00:00Z');

describe('targetTrack', () => {
  it.each([
    [6 * 60, 5, 73],
    [60, 25, 4],
    [60, 60, 2],
  ])('a %s min span every %s min holds %s samples, first and last at the ends', (spanMin, step, count) => {
    const end = new Date(start.getTime() + spanMin * 60_000);
    const track = targetTrack(GALACTIC_CENTRE_J2000, site, start, end, step);
    expect(track).toHaveLength(count);
    expect(track[0]?.timeMs).toBe(start.getTime());
    expect(track[track.length - 1]?.timeMs).toBe(end.getTime());
    expect(track[1]?.timeMs).toBe(start.getTime() + step * 60_000);
    const second = track[1];
    const h = targetHorizontal(GALACTIC_CENTRE_J2000, site, new Date(second?.timeMs ?? 0));
    expect(second?.azimuthDeg).toBeCloseTo(h.azimuthDeg, 9);
    expect(second?.altitudeDeg).toBeCloseTo(h.altitudeDeg, 9);
  });

  it('reaches the upper-culmination altitude 90 - |latitude - declination| over a day', () => {
    // from memory (spherical astronomy, upper culmination): 90 - |-33.9 - (-28.94)| = 85.04 deg;
    // the tolerance covers precession since J2000 (about 0.1 deg in Dec) and the 2 min sampling.
    const track = targetTrack(GALACTIC_CENTRE_J2000, site, new Date('2026-06-15T00:00:00Z'), new Date('2026-06-16T00:00:00Z'), 2, { refraction: false });
    const highest = Math.max(...track.map((p) => p.altitudeDeg));
    expect(Math.abs(highest - (90 - Math.abs(site.lat - GALACTIC_CENTRE_J2000.decDeg)))).toBeLessThan(0.3);
  });

  it.each([
    ['end before start', new Date('2026-06-15T07:00:00Z'), 5],
    ['a span over 48 h', new Date('2026-06-18T08:00:00Z'), 60],
    ['a step of 0', new Date('2026-06-15T09:00:00Z'), 0],
    ['an invalid end date', new Date('nope'), 5],
  ])('refuses %s with a RangeError', (_label, end, step) => {
    expect(() => targetTrack(GALACTIC_CENTRE_J2000, site, start, end, step)).toThrow(RangeError);
  });
});

describe('projectTicks', () => {
  it('puts the tick of the pointing time at the image centre and keeps only ticks in the image', () => {
    const end = new Date(start.getTime() + 8 * 3_600_000);
    const track = targetTrack(GALACTIC_CENTRE_J2000, site, start, end, 10);
    const aimed = track[24];
    const pose: CameraPose = { azimuthDeg: aimed?.azimuthDeg ?? 0, altitudeDeg: aimed?.altitudeDeg ?? 0, rollDeg: 0, horizontalFovDeg: 40, widthPx: 3000, heightPx: 2000 };
    const ticks = projectTicks(pose, track);
    const centre = ticks.find((t) => t.timeMs === aimed?.timeMs);
    expect(centre?.x).toBeCloseTo(1500, 6);
    expect(centre?.y).toBeCloseTo(1000, 6);
    expect(ticks.length).toBeGreaterThan(2);
    expect(ticks.length).toBeLessThan(track.length);
    for (const t of ticks) {
      expect(t.x).toBeGreaterThanOrEqual(0);
      expect(t.x).toBeLessThanOrEqual(3000);
      expect(t.y).toBeGreaterThanOrEqual(0);
      expect(t.y).toBeLessThanOrEqual(2000);
    }
  });

  it('refuses a sample without a finite time', () => {
    const pose: CameraPose = { azimuthDeg: 0, altitudeDeg: 0, rollDeg: 0, horizontalFovDeg: 40, widthPx: 3000, heightPx: 2000 };
    expect(() => projectTicks(pose, [{ azimuthDeg: 0, altitudeDeg: 0, timeMs: Number.NaN }])).toThrow(RangeError);
  });
});
