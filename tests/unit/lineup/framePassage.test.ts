import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { Body, DefineStar, Equator, Horizon, MakeTime, Observer, Refraction, SiderealTime } from 'astronomy-engine';
import { computeFramePassages } from '../../../shared/lineup';
import { directionAt, exactDirection, placeNodes, targetNodeDirections } from '../../../shared/lineup/apparentPlace';
import { checkFrame, frameGeometry, hourAngleArcs } from '../../../shared/lineup/framePassage';
import { apparentAltitudeDeg, geometricAltitudeDeg } from '../../../shared/lineup/refraction';
import { apparentFromTrueAltitudeDeg, trueFromApparentAltitudeDeg } from '../../../shared/sky/refraction';
import { oracleInFrame, scanIntervals } from './oracle';

const ARCSEC_PER_RAD = 206264.806;
const J2000_MS = Date.UTC(2000, 0, 1, 12);
const utOf = (iso: string): number => (Date.parse(iso) - J2000_MS) / 86_400_000;

describe('refraction of the frame band', () => {
  it.each([
    // Meeus, Astronomical Algorithms 2nd ed., ch. 16 (Bennett's formula, apparent altitude in):
    // 0.5 deg -> 28.754' (Example 16.a); 0, 5, 10, 45 deg -> 34.5', 9.9', 5.4', 1.0' (computed,
    // REFERENCES.md). astronomy-engine's 'normal' is Saemundsson's inverse formula, which Meeus
    // gives as consistent with Bennett's; tolerance 0.1'.
    { apparent: 0, arcmin: 34.5 },
    { apparent: 0.5, arcmin: 28.754 },
    { apparent: 5, arcmin: 9.9 },
    { apparent: 10, arcmin: 5.4 },
    { apparent: 45, arcmin: 1.0 },
  ])('lifts a geometric altitude to apparent $apparent deg by $arcmin arcmin', ({ apparent, arcmin }) => {
    const geometric = geometricAltitudeDeg(apparent);
    expect(Math.abs((apparent - geometric) * 60 - arcmin)).toBeLessThan(0.1);
  });

  it('inverts astronomy-engine Refraction to 1e-9 deg from the nadir to the zenith', () => {
    for (let h = -90; h <= 90; h += 0.37) {
      const apparent = h + Refraction('normal', h);
      if (apparent > 90) continue;
      expect(Math.abs(geometricAltitudeDeg(apparent) - h)).toBeLessThan(1e-9);
      expect(apparentAltitudeDeg(h)).toBeCloseTo(apparent, 12);
    }
    expect(() => geometricAltitudeDeg(Number.NaN)).toThrow(RangeError);
    expect(() => geometricAltitudeDeg(91)).toThrow(RangeError);
  });

  // The engine's fast path and the sky module's guarded functions share astronomy-engine's lift;
  // the sky module clamps it at 0 above a true altitude of 89.89 deg, where it is at most 0.116
  // arcsec below 0 (Refraction('normal', 90) = -0.1157 arcsec, computed).
  it('gives the same apparent altitudes as the sky module below 89.89 deg, and within 0.12 arcsec above', () => {
    for (let h = -90; h <= 90; h += 0.01) {
      const difference = apparentAltitudeDeg(h) - apparentFromTrueAltitudeDeg(h);
      if (h < 89.89) expect(difference).toBe(0);
      else expect(Math.abs(difference)).toBeLessThan(0.12 / 3600);
    }
  });

  it('inverts like the sky module to 1e-9 deg below 89.89 deg, and within 0.12 arcsec above', () => {
    for (let apparent = -90; apparent <= 90; apparent += 0.01) {
      const difference = Math.abs(geometricAltitudeDeg(apparent) - trueFromApparentAltitudeDeg(apparent));
      expect(difference).toBeLessThan(apparent < 89.89 ? 1e-9 : 0.12 / 3600);
    }
  });
});

describe('apparent place of fixed targets', () => {
  const targets = [
    { raHours: 17.7603, decDeg: -28.936 },
    { raHours: 5.5879, decDeg: -5.3897 },
    { raHours: 2.5449, decDeg: 61.457 },
    { raHours: 0.1, decDeg: 89.3 },
  ];

  it.each(targets)('matches astronomy-engine DefineStar + Equator(of date, aberration) to 0.01 arcsec (RA $raHours h)', (target) => {
    DefineStar(Body.Star8, target.raHours, target.decDeg, 1e9);
    const observer = new Observer(0, 0, 0);
    for (const iso of ['2026-03-20T00:00:00Z', '2029-09-01T12:00:00Z', '2035-12-31T06:00:00Z']) {
      const ut = utOf(iso);
      const eq = Equator(Body.Star8, MakeTime(ut), observer, true, true);
      const ra = (eq.ra * Math.PI) / 12;
      const dec = (eq.dec * Math.PI) / 180;
      const [x, y, z] = exactDirection(target, ut);
      const dot = x * Math.cos(dec) * Math.cos(ra) + y * Math.cos(dec) * Math.sin(ra) + z * Math.sin(dec);
      expect(Math.acos(Math.min(1, dot)) * ARCSEC_PER_RAD).toBeLessThan(0.01);
    }
  });

  it('interpolates between nodes at most 15 days apart to within 1 arcsec over ten years', () => {
    const from = utOf('2026-01-01T00:00:00Z');
    const to = from + 3652;
    const nodes = placeNodes(from, to);
    expect(nodes.spacing).toBeLessThanOrEqual(15);
    const out = new Float64Array(3);
    let worst = 0;
    for (const target of targets) {
      const dirs = targetNodeDirections(nodes, target);
      for (let t = from; t < to; t += 2.7) {
        directionAt(nodes, dirs, t, out);
        const [x, y, z] = exactDirection(target, t);
        worst = Math.max(worst, Math.acos(Math.min(1, out[0]! * x + out[1]! * y + out[2]! * z)) * ARCSEC_PER_RAD);
      }
    }
    // Measured 0.63 arcsec: the 13.7-day nutation term and the curvature of the annual aberration.
    expect(worst).toBeLessThan(1);
  });
});

describe('hour-angle arcs inside a frame', () => {
  // Checked against astronomy-engine's Horizon: for each hour angle, the RA that puts the target
  // there at a fixed instant, then Horizon (geometric) + Refraction('normal').
  const frameArb = fc.record({
    azimuthDeg: fc.double({ min: 0, max: 360, noNaN: true }),
    halfWidthDeg: fc.double({ min: 0.5, max: 180, noNaN: true }),
    bottomAltDeg: fc.double({ min: -10, max: 80, noNaN: true }),
    band: fc.double({ min: 1, max: 60, noNaN: true }),
  });

  it('agree with Horizon + Refraction at every sampled hour angle away from the edges', () => {
    const time = MakeTime(utOf('2027-01-01T00:00:00Z'));
    const gastHours = SiderealTime(time);
    fc.assert(
      fc.property(frameArb, fc.double({ min: -89, max: 89, noNaN: true }), fc.double({ min: -89.9, max: 89.9, noNaN: true }), (f, lat, dec) => {
        const frame = { azimuthDeg: f.azimuthDeg, halfWidthDeg: f.halfWidthDeg, bottomAltDeg: f.bottomAltDeg, topAltDeg: Math.min(90, f.bottomAltDeg + f.band) };
        const g = frameGeometry(frame, lat, 0);
        const arcs = hourAngleArcs(g, Math.sin((dec * Math.PI) / 180), Math.cos((dec * Math.PI) / 180));
        const observer = new Observer(lat, 0, 0);
        for (let k = 0; k < 360; k++) {
          const h = ((k + 0.5) / 360) * 2 * Math.PI;
          const nearEdge = arcs.some((a) => [-2 * Math.PI, 0, 2 * Math.PI].some((s) => Math.abs(a + s - h) < 1e-6));
          if (nearEdge) continue;
          // Arcs start in [0, 2 pi) and may end beyond 2 pi.
          const inArc = arcs.some((_, i) => i % 2 === 0 && [h, h + 2 * Math.PI].some((x) => x >= arcs[i]! && x <= arcs[i + 1]!));
          const raHours = (((gastHours - (h * 12) / Math.PI) % 24) + 24) % 24;
          const hor = Horizon(time, observer, raHours, dec);
          const alt = hor.altitude + Refraction('normal', hor.altitude);
          const dAz = Math.abs(((hor.azimuth - frame.azimuthDeg + 540) % 360) - 180);
          const inside = alt >= frame.bottomAltDeg && alt <= frame.topAltDeg && dAz <= frame.halfWidthDeg;
          // Skip samples within 1e-6 deg of an edge (float noise of the two computations).
          const margin = Math.min(Math.abs(alt - frame.bottomAltDeg), Math.abs(alt - frame.topAltDeg), Math.abs(dAz - frame.halfWidthDeg));
          if (margin < 1e-6) continue;
          if (inArc !== inside) return false;
        }
        return true;
      }),
      { numRuns: 150, seed: 4242 },
    );
  });

  it('returns the whole circle for a whole-sky frame and nothing for a frame the path misses', () => {
    const whole = frameGeometry({ azimuthDeg: 0, halfWidthDeg: 180, bottomAltDeg: -90, topAltDeg: 90 }, 45, 0);
    expect(hourAngleArcs(whole, Math.sin(0.3), Math.cos(0.3))).toEqual([0, 2 * Math.PI]);
    const south = frameGeometry({ azimuthDeg: 180, halfWidthDeg: 10, bottomAltDeg: 0, topAltDeg: 20 }, 45, 0);
    // Dec +80 at 45 N never stands in the south.
    expect(hourAngleArcs(south, Math.sin((80 * Math.PI) / 180), Math.cos((80 * Math.PI) / 180))).toEqual([]);
  });
});

describe('frame passages over time against the oracle', () => {
  it.each([
    { name: 'the North Pole', site: { lat: 90, lon: 0, elevationM: 0 }, frame: { azimuthDeg: 200, halfWidthDeg: 30, bottomAltDeg: 20, topAltDeg: 40 }, target: { raHours: 3, decDeg: 30 } },
    { name: 'the South Pole', site: { lat: -90, lon: 0, elevationM: 2800 }, frame: { azimuthDeg: 10, halfWidthDeg: 40, bottomAltDeg: 25, topAltDeg: 35 }, target: { raHours: 17.76, decDeg: -28.94 } },
    { name: 'a mid-latitude frame across north', site: { lat: 40, lon: -105, elevationM: 1600 }, frame: { azimuthDeg: 355, halfWidthDeg: 20, bottomAltDeg: 0, topAltDeg: 15 }, target: { raHours: 12.5, decDeg: 55 } },
  ])('match at $name within 1 s over a week', ({ site, frame, target }) => {
    const from = Date.parse('2027-02-01T00:00:00Z');
    const to = Date.parse('2027-02-08T00:00:00Z');
    const engine = computeFramePassages(frame, site, target, new Date(from), new Date(to));
    const oracle = scanIntervals((ms) => oracleInFrame(site, frame, target, ms), from, to, 60_000);
    expect(oracle.length).toBeGreaterThan(3);
    expect(engine.length).toBe(oracle.length);
    engine.forEach((e, i) => {
      expect(Math.abs(e.start.getTime() - oracle[i]!.startMs)).toBeLessThan(1000);
      expect(Math.abs(e.end.getTime() - oracle[i]!.endMs)).toBeLessThan(1000);
    });
  });

  it('keeps a target inside a whole-sky frame for the whole range', () => {
    const r = computeFramePassages({ azimuthDeg: 0, halfWidthDeg: 180, bottomAltDeg: -90, topAltDeg: 90 }, { lat: 10, lon: 10, elevationM: 0 }, { raHours: 1, decDeg: 1 }, new Date('2027-01-01T00:00:00Z'), new Date('2027-01-05T00:00:00Z'));
    expect(r).toEqual([{ start: new Date('2027-01-01T00:00:00Z'), end: new Date('2027-01-05T00:00:00Z') }]);
  });

  it.each([
    { name: 'NaN azimuth', frame: { azimuthDeg: Number.NaN, halfWidthDeg: 5, bottomAltDeg: 0, topAltDeg: 10 } },
    { name: 'azimuth 361', frame: { azimuthDeg: 361, halfWidthDeg: 5, bottomAltDeg: 0, topAltDeg: 10 } },
    { name: 'zero half-width', frame: { azimuthDeg: 10, halfWidthDeg: 0, bottomAltDeg: 0, topAltDeg: 10 } },
    { name: 'top below bottom', frame: { azimuthDeg: 10, halfWidthDeg: 5, bottomAltDeg: 10, topAltDeg: 0 } },
    { name: 'altitude 95', frame: { azimuthDeg: 10, halfWidthDeg: 5, bottomAltDeg: 0, topAltDeg: 95 } },
  ])('rejects a frame with $name', ({ frame }) => {
    expect(() => checkFrame(frame)).toThrow(RangeError);
  });
});
