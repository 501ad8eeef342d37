import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  DEW_SPREAD_HIGH_C,
  DEW_SPREAD_MODERATE_C,
  dewPointC,
  dewRiskOfHour,
  relativeHumidityFromDewPointPct,
  saturationVapourPressureHpa,
  worseDewRisk,
} from '../../../shared/outlook';

/**
 * Saturation vapour pressure over water by Sonntag (1994), "Advancements in the field of
 * hygrometry", Meteorol. Z. 3, 51-66, with the coefficients as quoted in Helten et al. (1999),
 * JGR 104, 26087-26096 (T in K, result in Pa), converted to hPa. An independent formulation to
 * check the Magnus form against.
 */
function sonntagHpa(temperatureC: number): number {
  const t = temperatureC + 273.15;
  return Math.exp(-6096.9385 / t + 21.2409642 - 2.711193e-2 * t + 1.673952e-5 * t * t + 2.433502 * Math.log(t)) / 100;
}

describe('saturationVapourPressureHpa (Magnus form, Alduchov and Eskridge 1996)', () => {
  it('is the Magnus constant 6.1094 hPa at 0 deg C', () => {
    // Alduchov and Eskridge (1996), J. Appl. Meteor. 35, 601-609: e_s(0) = 6.1094 hPa by construction.
    expect(saturationVapourPressureHpa(0)).toBe(6.1094);
  });

  it('agrees with Sonntag (1994) within 0.4 % from -40 to +50 deg C', () => {
    // 0.4 % is the accuracy Alduchov and Eskridge give for their constants over -40..+50 deg C
    // (from memory); Sonntag's formula is the reference (see sonntagHpa above).
    for (let t = -40; t <= 50; t += 1) {
      const relative = Math.abs(saturationVapourPressureHpa(t) / sonntagHpa(t) - 1);
      expect(relative, `at ${t} deg C`).toBeLessThan(0.004);
    }
  });

  it('agrees with Sonntag (1994) at 20 deg C within 0.3 %, where the formulae are 23.39 hPa', () => {
    // Sonntag (1994) gives 23.39 hPa at 20 deg C (computed from the quoted coefficients); the
    // Magnus form with these constants is 0.25 % low there.
    expect(sonntagHpa(20)).toBeCloseTo(23.39, 2);
    expect(Math.abs(saturationVapourPressureHpa(20) / 23.39 - 1)).toBeLessThan(0.003);
  });

  it.each([[Number.NaN], [Infinity], [-96], [66]])('refuses %s deg C', (t) => {
    expect(() => saturationVapourPressureHpa(t)).toThrow(RangeError);
  });
});

describe('dewPointC', () => {
  it('matches the MetPy documentation example: 10 deg C at 50 % has a dew point of 0.0479 deg C', () => {
    // MetPy (Unidata), metpy.calc.dewpoint_from_relative_humidity, latest documentation example:
    // dewpoint_from_relative_humidity(10 degC, 50 percent) = 0.047900916 degC. MetPy uses its own
    // saturation vapour pressure formula, so allow 0.01 deg C.
    expect(Math.abs(dewPointC(10, 50) - 0.047900916)).toBeLessThan(0.01);
  });

  it('is the temperature itself at 100 % humidity', () => {
    // Definition of the dew point: saturated air is at its dew point.
    for (const t of [-30, -5, 0, 12.5, 35]) expect(dewPointC(t, 100)).toBeCloseTo(t, 10);
  });

  it('inverts relativeHumidityFromDewPointPct (round trip through the Magnus form)', () => {
    fc.assert(fc.property(
      fc.double({ min: -40, max: 50, noNaN: true }),
      fc.double({ min: 1, max: 100, noNaN: true }),
      (t, rh) => {
        const td = dewPointC(t, rh);
        expect(td).toBeLessThanOrEqual(t + 1e-9);
        expect(relativeHumidityFromDewPointPct(t, Math.min(td, t))).toBeCloseTo(rh, 6);
      },
    ));
  });

  it.each([
    [20, 0], [20, -1], [20, 100.5], [Number.NaN, 50], [20, Number.NaN], [-100, 50],
  ])('refuses temperature %s deg C with humidity %s %%', (t, rh) => {
    expect(() => dewPointC(t, rh)).toThrow(RangeError);
  });

  it('refuses a dew point above the temperature in relativeHumidityFromDewPointPct', () => {
    expect(() => relativeHumidityFromDewPointPct(5, 6)).toThrow(RangeError);
  });
});

describe('dewRiskOfHour (rule: common practice)', () => {
  const hour = (temperatureC: number | null, dewPoint: number | null, rh: number | null) => ({ temperatureC, dewPointC: dewPoint, relativeHumidityPct: rh });

  it.each([
    ['spread 0.5 deg C', hour(8, 7.5, null), 'high', 0.5],
    ['spread exactly the high limit', hour(8, 8 - DEW_SPREAD_HIGH_C, null), 'high', DEW_SPREAD_HIGH_C],
    ['spread 3 deg C', hour(8, 5, null), 'moderate', 3],
    ['spread exactly the moderate limit', hour(8, 8 - DEW_SPREAD_MODERATE_C, null), 'moderate', DEW_SPREAD_MODERATE_C],
    ['spread 6 deg C', hour(8, 2, null), 'low', 6],
    ['dew point above the temperature (fog) is a spread of 0', hour(3, 3.2, null), 'high', 0],
  ])('%s: %s', (_label, h, risk, spread) => {
    const result = dewRiskOfHour(h);
    expect(result.risk).toBe(risk);
    expect(result.spreadC).toBeCloseTo(spread, 10);
  });

  it('computes the dew point from temperature and humidity when the service gave none', () => {
    // 10 deg C at 50 %: dew point 0.05 deg C (MetPy example above), spread about 9.95: low.
    const result = dewRiskOfHour(hour(10, null, 50));
    expect(result.risk).toBe('low');
    expect(result.spreadC!).toBeCloseTo(10 - dewPointC(10, 50), 10);
    // 10 deg C at 95 %: dew point about 9.2 deg C by the Magnus form, spread under 2: high.
    expect(dewRiskOfHour(hour(10, null, 95)).risk).toBe('high');
  });

  it('falls back on humidity alone, and says unknown with nothing to go on', () => {
    expect(dewRiskOfHour(hour(null, null, 92))).toEqual({ risk: 'high', spreadC: null });
    expect(dewRiskOfHour(hour(null, null, 85))).toEqual({ risk: 'moderate', spreadC: null });
    expect(dewRiskOfHour(hour(null, null, 60))).toEqual({ risk: 'low', spreadC: null });
    expect(dewRiskOfHour(hour(null, 4, null))).toEqual({ risk: 'unknown', spreadC: null });
    expect(dewRiskOfHour(hour(12, null, null))).toEqual({ risk: 'unknown', spreadC: null });
  });

  it('the humidity limits sit inside the spread limits at 0..20 deg C, as the module notes say', () => {
    // Computed with the Magnus form: 90 % is a spread of 1.4..1.7 deg C, 80 % one of 3.0..3.6 deg C.
    for (const t of [0, 10, 20]) {
      const s90 = t - dewPointC(t, 90);
      const s80 = t - dewPointC(t, 80);
      expect(s90).toBeGreaterThan(1.4);
      expect(s90).toBeLessThanOrEqual(DEW_SPREAD_HIGH_C);
      expect(s80).toBeGreaterThan(3.0);
      expect(s80).toBeLessThanOrEqual(DEW_SPREAD_MODERATE_C);
    }
  });

  it('refuses values out of range', () => {
    expect(() => dewRiskOfHour(hour(10, null, 120))).toThrow(RangeError);
    expect(() => dewRiskOfHour(hour(Number.NaN, 3, null))).toThrow(RangeError);
  });

  it('worseDewRisk keeps the higher risk and lets any known risk beat unknown', () => {
    expect(worseDewRisk('low', 'high')).toBe('high');
    expect(worseDewRisk('moderate', 'low')).toBe('moderate');
    expect(worseDewRisk('unknown', 'low')).toBe('low');
    expect(worseDewRisk('unknown', 'unknown')).toBe('unknown');
  });
});
