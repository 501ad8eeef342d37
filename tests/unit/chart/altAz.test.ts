import { describe, expect, it } from 'vitest';
import { altAzView, azimuthOffsetDeg, landmarkSilhouette, nightChartSeries } from '../../../shared/chart';
import { frameFromSightline, sightlineGeometry } from '../../../shared/geo';
import { findTarget, targetHorizontal } from '../../../shared/sky';

const GC = findTarget('galactic-centre')!;
const VANTAGE = { lat: 50.579, lon: -4.914, elevationM: 3, cameraHeightM: 1.5 };
const LANDMARK = { lat: 50.5712, lon: -4.9085, baseElevationM: 0, heightM: 38, widthM: 14 };
const SITE = { lat: 50.579, lon: -4.914, elevationM: 4.5 };
const FRAME = frameFromSightline(VANTAGE, LANDMARK, { bandHeightDeg: 20 });
const SERIES = nightChartSeries({ site: SITE, timeZone: 'Europe/London', date: '2027-05-10', target: GC, frame: FRAME });

describe('azimuthOffsetDeg', () => {
  it.each([
    [10, 350, 20],
    [350, 10, -20],
    [180, 0, 180],
    [155, 155, 0],
  ])('%s deg from a centre at %s deg is %s deg', (az, centre, offset) => {
    expect(azimuthOffsetDeg(az, centre)).toBeCloseTo(offset, 9);
  });

  it('rejects NaN', () => {
    expect(() => azimuthOffsetDeg(Number.NaN, 0)).toThrow(RangeError);
  });
});

describe('altAzView on the demo south-facing sightline (May night, galactic centre)', () => {
  const view = altAzView(SERIES, FRAME);

  it('centres on the frame and shows 25 deg either side by default', () => {
    expect(view.centreAzDeg).toBe(FRAME.azimuthDeg);
    expect(view.halfSpanDeg).toBe(25);
  });

  it('keeps the track within the span (one sample past each edge) and each point true to targetHorizontal', () => {
    expect(view.track.length).toBeGreaterThan(0);
    for (const piece of view.track) {
      const inner = piece.slice(1, -1);
      for (const p of inner) {
        expect(Math.abs(p.offsetDeg)).toBeLessThanOrEqual(25);
        const pos = targetHorizontal(GC, SITE, new Date(p.atMs));
        expect(p.altDeg).toBeCloseTo(pos.altitudeDeg, 9);
        expect(p.offsetDeg).toBeCloseTo(azimuthOffsetDeg(pos.azimuthDeg, FRAME.azimuthDeg), 9);
      }
    }
  });

  it('marks the target at full local hours within 0.05 deg of its computed place', () => {
    expect(view.hourMarks.length).toBeGreaterThan(0);
    for (const mark of view.hourMarks) {
      expect(mark.label).toMatch(/^\d\d:00$/);
      const pos = targetHorizontal(GC, SITE, new Date(mark.atMs));
      expect(Math.abs(mark.altDeg - pos.altitudeDeg)).toBeLessThan(0.05);
      expect(Math.abs(mark.offsetDeg - azimuthOffsetDeg(pos.azimuthDeg, FRAME.azimuthDeg))).toBeLessThan(0.05);
    }
  });

  it('reaches from below the horizon to above the frame top', () => {
    expect(view.altDomainDeg[0]).toBeLessThan(0);
    expect(view.altDomainDeg[1]).toBeGreaterThan(FRAME.topAltDeg);
    expect(view.altDomainDeg[1]).toBeLessThanOrEqual(90);
  });

  it('rejects a span narrower than the frame', () => {
    expect(() => altAzView(SERIES, FRAME, { halfSpanDeg: FRAME.halfWidthDeg / 2 })).toThrow(RangeError);
  });
});

describe('landmarkSilhouette', () => {
  const g = sightlineGeometry(VANTAGE, LANDMARK);
  const outline = landmarkSilhouette(g.angularWidthDeg, g.baseElevationDeg, g.topElevationDeg);

  it('spans the landmark width and reaches exactly from its base to its top elevation angle', () => {
    const offsets = outline.map((p) => p[0]);
    const alts = outline.map((p) => p[1]);
    expect(Math.min(...offsets)).toBeCloseTo(-g.angularWidthDeg / 2, 9);
    expect(Math.max(...offsets)).toBeCloseTo(g.angularWidthDeg / 2, 9);
    expect(Math.min(...alts)).toBeCloseTo(g.baseElevationDeg, 9);
    expect(Math.max(...alts)).toBeCloseTo(g.topElevationDeg, 9);
    // The landmark top is the frame's bottom (frame.ts).
    expect(Math.max(...alts)).toBeCloseTo(FRAME.bottomAltDeg, 9);
  });

  it.each([
    [-1, 0, 1],
    [1, 2, 1],
    [1, Number.NaN, 1],
  ])('rejects width %s, base %s, top %s', (w, base, top) => {
    expect(() => landmarkSilhouette(w, base, top)).toThrow(RangeError);
  });
});
