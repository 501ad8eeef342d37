import { describe, expect, it } from 'vitest';
import {
  AstroTime, Body, Equator, GeoMoon, GeoVector, Horizon, Illumination, MakeTime, Observer, RotateVector, Rotation_EQJ_EQD, SearchRiseSet, SiderealTime,
} from 'astronomy-engine';
import { apparentSiderealRad, moonGeocentricOfDate, sunGeocentricOfDate } from '../../../shared/lineup/ephemeris';
import { fitChebyshev, evalChebyshev, evalChebyshev3 } from '../../../shared/lineup/chebyshev';
import { SiteSky } from '../../../shared/lineup/siteSky';

const ARCSEC_PER_RAD = 206264.806;
const J2000_MS = Date.UTC(2000, 0, 1, 12);
const utOf = (iso: string): number => (Date.parse(iso) - J2000_MS) / 86_400_000;

/** Deterministic pseudo-random times in UT days (linear congruential generator). */
function sampleTimes(count: number, fromUt: number, spanDays: number, seed: number): number[] {
  let s = seed;
  const out: number[] = [];
  for (let i = 0; i < count; i++) {
    s = (s * 1103515245 + 12345) % 2147483648;
    out.push(fromUt + (s / 2147483648) * spanDays);
  }
  return out;
}

/** Angle between two vectors, arcsec, and relative length difference. */
function compare(a: ArrayLike<number>, b: { x: number; y: number; z: number }): { angleArcsec: number; relLength: number } {
  const la = Math.hypot(a[0]!, a[1]!, a[2]!);
  const lb = Math.hypot(b.x, b.y, b.z);
  const cross = Math.hypot(a[1]! * b.z - a[2]! * b.y, a[2]! * b.x - a[0]! * b.z, a[0]! * b.y - a[1]! * b.x);
  return { angleArcsec: Math.atan2(cross, a[0]! * b.x + a[1]! * b.y + a[2]! * b.z) * ARCSEC_PER_RAD, relLength: Math.abs(la - lb) / lb };
}

describe('Chebyshev series', () => {
  it('reproduces a polynomial of lower degree exactly and a smooth function to 1e-12', () => {
    const coeffs = fitChebyshev((t, out) => {
      out[0] = 3 * t * t - 2 * t + 1;
      out[1] = Math.sin(t);
      out[2] = Math.exp(-t);
    }, 0, 2, 16, 3);
    const out = new Float64Array(3);
    for (const t of [0, 0.3, 1, 1.7, 2]) {
      const x = t - 1;
      expect(evalChebyshev(coeffs, 0, 16, x)).toBeCloseTo(3 * t * t - 2 * t + 1, 12);
      evalChebyshev3(coeffs, 0, 16, x, out);
      expect(out[1]).toBeCloseTo(Math.sin(t), 12);
      expect(out[2]).toBeCloseTo(Math.exp(-t), 12);
    }
  });

  it('rejects a reversed interval and silly term counts', () => {
    expect(() => fitChebyshev(() => undefined, 1, 1, 8, 1)).toThrow(RangeError);
    expect(() => fitChebyshev(() => undefined, 0, 1, 1, 1)).toThrow(RangeError);
    expect(() => fitChebyshev(() => undefined, 0, 1, 8, 0)).toThrow(RangeError);
  });
});

describe('fit error of the Sun and Moon tables against astronomy-engine, 2000-2040', () => {
  // Reference: astronomy-engine's own geocentric apparent positions of date (GeoVector / GeoMoon
  // rotated by Rotation_EQJ_EQD) and SiderealTime, at 3000 pseudo-random instants.
  const times = sampleTimes(3000, 0, 14_610, 20_260_501);
  const out = new Float64Array(3);

  it('keeps the Sun within 0.002 arcsec in direction and 1e-8 in distance', () => {
    let angle = 0;
    let length = 0;
    for (const ut of times) {
      const t = MakeTime(ut);
      sunGeocentricOfDate(ut, out);
      const c = compare(out, RotateVector(Rotation_EQJ_EQD(t), GeoVector(Body.Sun, t, true)));
      angle = Math.max(angle, c.angleArcsec);
      length = Math.max(length, c.relLength);
    }
    // Measured: 0.0003 arcsec, 1e-9.
    expect(angle).toBeLessThan(0.002);
    expect(length).toBeLessThan(1e-8);
  });

  it('keeps the Moon within 0.01 arcsec in direction and 1e-7 in distance', () => {
    let angle = 0;
    let length = 0;
    for (const ut of times) {
      const t = MakeTime(ut);
      moonGeocentricOfDate(ut, out);
      const c = compare(out, RotateVector(Rotation_EQJ_EQD(t), GeoMoon(t)));
      angle = Math.max(angle, c.angleArcsec);
      length = Math.max(length, c.relLength);
    }
    // Measured: 0.0012 arcsec, 6e-9.
    expect(angle).toBeLessThan(0.01);
    expect(length).toBeLessThan(1e-7);
  });

  it('keeps Greenwich apparent sidereal time within 0.002 arcsec of SiderealTime', () => {
    let worst = 0;
    for (const ut of times) {
      let d = apparentSiderealRad(ut) - (SiderealTime(MakeTime(ut)) * Math.PI) / 12;
      d -= 2 * Math.PI * Math.round(d / (2 * Math.PI));
      worst = Math.max(worst, Math.abs(d) * ARCSEC_PER_RAD);
    }
    expect(worst).toBeLessThan(0.002);
  });
});

describe('site altitudes from the tables', () => {
  const sites = [
    { lat: 52.1, lon: -7.0, elevationM: 0 },
    { lat: -35.3, lon: 149.1, elevationM: 600 },
    { lat: 69.6, lon: 18.9, elevationM: 10 },
    { lat: 0.2, lon: -78.5, elevationM: 2800 },
  ];
  const times = sampleTimes(400, utOf('2026-01-01T00:00:00Z'), 3650, 77);

  it.each(sites)('match astronomy-engine Equator + Horizon to 1e-6 deg at $lat, $lon', (site) => {
    const sky = new SiteSky(site);
    const obs = new Observer(site.lat, site.lon, site.elevationM);
    let worst = 0;
    for (const ut of times) {
      const t = MakeTime(ut);
      const sun = Equator(Body.Sun, t, obs, true, true);
      const moon = Equator(Body.Moon, t, obs, true, true);
      worst = Math.max(
        worst,
        Math.abs(sky.sunAltitudeDeg(ut) - Horizon(t, obs, sun.ra, sun.dec).altitude),
        Math.abs(sky.moonAltitudeDeg(ut) - Horizon(t, obs, moon.ra, moon.dec).altitude),
      );
    }
    expect(worst).toBeLessThan(1e-6);
  });

  it('gives the illuminated fraction of astronomy-engine within 1e-6', () => {
    const sky = new SiteSky(sites[0]!);
    let worst = 0;
    for (const ut of times) worst = Math.max(worst, Math.abs(sky.moonIlluminatedFraction(ut) - Illumination(Body.Moon, MakeTime(ut)).phase_fraction));
    expect(worst).toBeLessThan(1e-6);
  });

  it('matches Meeus Example 47.a (Moon, 1992-04-12 0h TD) to 1 arcmin and 48.a illumination to 1e-3', () => {
    // Meeus, Astronomical Algorithms 2nd ed.: apparent RA 134.688470 deg, Dec +13.768368 deg;
    // illuminated fraction 0.6786 (Example 48.a). Tolerances as REFERENCES.md gives them for
    // astronomy-engine-based values.
    const ut = AstroTime.FromTerrestrialTime(2448724.5 - 2451545.0).ut;
    const v = new Float64Array(3);
    moonGeocentricOfDate(ut, v);
    const ra = ((Math.atan2(v[1]!, v[0]!) * 180) / Math.PI + 360) % 360;
    const dec = (Math.asin(v[2]! / Math.hypot(v[0]!, v[1]!, v[2]!)) * 180) / Math.PI;
    expect(Math.abs(ra - 134.68847) * Math.cos((dec * Math.PI) / 180)).toBeLessThan(1 / 60);
    expect(Math.abs(dec - 13.768368)).toBeLessThan(1 / 60);
    expect(Math.abs(new SiteSky(sites[0]!).moonIlluminatedFraction(ut) - 0.6786)).toBeLessThan(1e-3);
  });

  it('puts the Moon-down boundary at astronomy-engine moonrise and moonset (sea level) within 1 s', () => {
    // SearchRiseSet uses the same definition at sea level: upper limb + 34 arcmin refraction.
    const site = { lat: 45.0, lon: 7.0, elevationM: 0 };
    const sky = new SiteSky(site);
    const obs = new Observer(site.lat, site.lon, 0);
    let start = MakeTime(utOf('2027-03-01T00:00:00Z'));
    let checked = 0;
    for (let i = 0; i < 20; i++) {
      for (const direction of [+1, -1]) {
        const event = SearchRiseSet(Body.Moon, obs, direction, start, 2);
        if (!event) continue;
        // The limb function changes sign within +-1 s of the library's event.
        const before = sky.moonLimbSin(event.ut - 1 / 86400);
        const after = sky.moonLimbSin(event.ut + 1 / 86400);
        expect(Math.sign(before)).toBe(-direction);
        expect(Math.sign(after)).toBe(direction);
        checked++;
      }
      start = start.AddDays(1.1);
    }
    expect(checked).toBeGreaterThan(30);
  });
});
