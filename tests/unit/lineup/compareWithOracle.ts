/**
 * Runs the engine and the brute-force oracle on one case and pairs their lineups.
 */
import { expect } from 'vitest';
import { searchLineups, type Lineup } from '../../../shared/lineup';
import {
  oracleLineups, oracleMoon, oracleMoonIllumination, oracleSunAltitudeDeg, oracleTargetHorizontal,
  type MsInterval, type OracleConditions, type OracleFrame, type OracleSite, type OracleTarget,
} from './oracle';

export interface OracleCase {
  name: string;
  site: OracleSite;
  frame: OracleFrame;
  target: OracleTarget;
  from: string;
  to: string;
  conditions: OracleConditions;
  /** Least number of lineups of 2 min or more expected (0 for a case that must find none). */
  minLineups: number;
}

/** The contract of the engine issue: boundaries within 1 min; lineups from 2 min up matched. */
export const BOUNDARY_TOLERANCE_S = 60;
export const MATCH_MIN_DURATION_MIN = 2;

const overlaps = (a: { s: number; e: number }, b: { s: number; e: number }): boolean => a.s < b.e && b.s < a.e;

/**
 * Compares engine and oracle on a case, asserting the contract, and returns the largest boundary
 * difference (s) and the lineups.
 */
export function compareWithOracle(c: OracleCase): { worstS: number; engine: Lineup[]; oracle: MsInterval[] } {
  const fromMs = Date.parse(c.from);
  const toMs = Date.parse(c.to);
  const engine = searchLineups(c.frame, c.site, c.target, new Date(fromMs), new Date(toMs), { ...c.conditions, minDurationMin: 0 });
  const oracle = oracleLineups(c.site, c.frame, c.target, c.conditions, fromMs, toMs);
  const e = engine.map((l) => ({ s: l.start.getTime(), e: l.end.getTime() }));
  const o = oracle.map((l) => ({ s: l.startMs, e: l.endMs }));
  const minMs = MATCH_MIN_DURATION_MIN * 60_000;
  let worst = 0;
  const problems: string[] = [];
  for (const [mine, theirs, label] of [[e, o, 'engine'], [o, e, 'oracle']] as const) {
    for (const x of mine) {
      if (x.e - x.s < minMs) continue;
      const y = theirs.find((t) => overlaps(t, x));
      if (!y) {
        problems.push(`${label} lineup ${new Date(x.s).toISOString()} (${((x.e - x.s) / 60_000).toFixed(1)} min) has no counterpart`);
        continue;
      }
      const d = Math.max(Math.abs(x.s - y.s), Math.abs(x.e - y.e)) / 1000;
      worst = Math.max(worst, d);
      if (d > BOUNDARY_TOLERANCE_S) problems.push(`${label} lineup ${new Date(x.s).toISOString()} differs by ${d.toFixed(1)} s`);
    }
  }
  expect(problems).toEqual([]);
  expect(o.filter((x) => x.e - x.s >= minMs).length).toBeGreaterThanOrEqual(c.minLineups);
  if (c.minLineups === 0) expect(engine).toEqual([]);
  return { worstS: worst, engine, oracle };
}

/** Checks the sky values the engine reports at each peak against exact positions. */
export function checkPeakValues(c: OracleCase, lineups: Lineup[]): void {
  for (const l of lineups) {
    const ms = l.peak.getTime();
    expect(ms).toBeGreaterThanOrEqual(l.start.getTime());
    expect(ms).toBeLessThanOrEqual(l.end.getTime());
    const t = oracleTargetHorizontal(c.site, c.target, ms);
    const dAz = Math.abs(((t.azimuthDeg - l.peakAzimuthDeg + 540) % 360) - 180);
    expect(dAz * Math.cos((t.altitudeDeg * Math.PI) / 180)).toBeLessThan(1e-3);
    expect(Math.abs(t.altitudeDeg - l.peakAltitudeDeg)).toBeLessThan(1e-3);
    expect(Math.abs(oracleSunAltitudeDeg(c.site, ms) - l.sunAltitudeDeg)).toBeLessThan(1e-5);
    expect(Math.abs(oracleMoon(c.site, ms).altitudeDeg - l.moonAltitudeDeg)).toBeLessThan(1e-5);
    expect(Math.abs(oracleMoonIllumination(ms) - l.moonIllumination)).toBeLessThan(1e-5);
    expect(l.score).toBeGreaterThanOrEqual(0);
    expect(l.score).toBeLessThanOrEqual(1);
  }
}
