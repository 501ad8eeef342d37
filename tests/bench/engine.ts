/**
 * Benchmark of the lineup engine against the brute-force oracle. Prints figures; asserts nothing
 * about speed (no timed tests). Run: `node --import tsx tests/bench/engine.ts`.
 *
 * Figures: the oracle's time for a one-year search of one target; the engine's time for the same
 * search (warm: tables fitted and code optimised, median of several runs), their ratio; a
 * ten-year search; a one-year search for 20 targets at once; dark windows per site-year; and the
 * first (cold) search of a process, which includes fitting the Sun and Moon tables.
 */
import { pathToFileURL } from 'node:url';
import { computeDarkWindows, searchLineups, type Lineup } from '../../shared/lineup';
import { clearEphemerisCache } from '../../shared/lineup/ephemeris';
import { oracleLineups } from '../unit/lineup/oracle';

export interface EngineBenchFigures {
  /** Brute-force oracle, one target, one year, ms (one run). */
  oracleYearMs: number;
  /** Engine, same search, warm median, ms. */
  engineYearMs: number;
  /** Fastest warm run of the same search, ms. */
  engineYearMinMs: number;
  /** oracleYearMs / engineYearMs. */
  ratio: number;
  /** Engine, one target, ten years, warm median, ms. */
  engineTenYearsMs: number;
  /** Engine, 20 targets, one year, warm median, ms. */
  engineTwentyTargetsMs: number;
  /** Dark windows for one site-year, warm median, ms. */
  darkWindowsSiteYearMs: number;
  /** First search of the process for one year, tables cold, ms. */
  engineYearColdMs: number;
  /** Ten-year search with the tables cleared first (fits ten years of tables), ms. */
  engineTenYearsColdTablesMs: number;
  /** Agreement on the benchmark year: lineups of 2 min or more, and the largest boundary difference (s). */
  agreement: { engineLineups: number; oracleLineups: number; worstBoundaryS: number };
  /** Machine load average (1 min) at the start: figures are noisy when other work runs. */
  loadAverage: number;
}

// Galactic centre, J2000 (IAU frame as astropy defines it; REFERENCES.md).
const GALACTIC_CENTRE = { raHours: 17 + 45 / 60 + 37.2 / 3600, decDeg: -(28 + 56 / 60 + 10.2 / 3600) };
const SITE = { lat: 44.3, lon: 9.2, elevationM: 150 };
const FRAME = { azimuthDeg: 150, halfWidthDeg: 25, bottomAltDeg: 3, topAltDeg: 28 };
const CONDITIONS = { sunMaxAltDeg: -18, moon: 'down' as const };
const FROM = new Date('2027-01-01T00:00:00Z');
const TO = new Date('2028-01-01T00:00:00Z');
const TO_TEN = new Date('2037-01-01T00:00:00Z');
const TWENTY_TARGETS = Array.from({ length: 20 }, (_, i) => ({ raHours: (i * 1.21) % 24, decDeg: -45 + i * 4.5 }));

function timeOnce(f: () => unknown): number {
  const start = performance.now();
  f();
  return performance.now() - start;
}

function median(f: () => unknown, runs: number, warmups: number): { median: number; min: number } {
  for (let i = 0; i < warmups; i++) f();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) times.push(timeOnce(f));
  times.sort((a, b) => a - b);
  return { median: times[Math.floor(runs / 2)]!, min: times[0]! };
}

async function loadAverage(): Promise<number> {
  try {
    const os = await import('node:os');
    return os.loadavg()[0] ?? Number.NaN;
  } catch {
    return Number.NaN;
  }
}

function agreement(engine: Lineup[], oracle: { startMs: number; endMs: number }[]): EngineBenchFigures['agreement'] {
  const long = (s: number, e: number): boolean => e - s >= 120_000;
  let worst = 0;
  for (const l of engine) {
    const o = oracle.find((x) => x.startMs < l.end.getTime() && l.start.getTime() < x.endMs);
    if (o) worst = Math.max(worst, Math.abs(o.startMs - l.start.getTime()), Math.abs(o.endMs - l.end.getTime()));
  }
  return {
    engineLineups: engine.filter((l) => long(l.start.getTime(), l.end.getTime())).length,
    oracleLineups: oracle.filter((o) => long(o.startMs, o.endMs)).length,
    worstBoundaryS: worst / 1000,
  };
}

/** Runs the benchmark, prints the figures and returns them. */
export async function runEngineBench(log: (line: string) => void = console.log): Promise<EngineBenchFigures> {
  const load = await loadAverage();
  clearEphemerisCache();
  const engineYearColdMs = timeOnce(() => searchLineups(FRAME, SITE, GALACTIC_CENTRE, FROM, TO, CONDITIONS));
  const year = median(() => searchLineups(FRAME, SITE, GALACTIC_CENTRE, FROM, TO, CONDITIONS), 21, 20);
  const dark = median(() => computeDarkWindows(SITE, FROM, TO, CONDITIONS), 21, 10);
  const twenty = median(() => searchLineups(FRAME, SITE, TWENTY_TARGETS, FROM, TO, CONDITIONS), 11, 5);
  clearEphemerisCache();
  const engineTenYearsColdTablesMs = timeOnce(() => searchLineups(FRAME, SITE, GALACTIC_CENTRE, FROM, TO_TEN, CONDITIONS));
  const ten = median(() => searchLineups(FRAME, SITE, GALACTIC_CENTRE, FROM, TO_TEN, CONDITIONS), 7, 3);

  let oracle: { startMs: number; endMs: number }[] = [];
  const oracleYearMs = timeOnce(() => {
    oracle = oracleLineups(SITE, FRAME, GALACTIC_CENTRE, CONDITIONS, FROM.getTime(), TO.getTime());
  });
  const engineRaw = searchLineups(FRAME, SITE, GALACTIC_CENTRE, FROM, TO, { ...CONDITIONS, minDurationMin: 0 });

  const figures: EngineBenchFigures = {
    oracleYearMs,
    engineYearMs: year.median,
    engineYearMinMs: year.min,
    ratio: oracleYearMs / year.median,
    engineTenYearsMs: ten.median,
    engineTwentyTargetsMs: twenty.median,
    darkWindowsSiteYearMs: dark.median,
    engineYearColdMs,
    engineTenYearsColdTablesMs,
    agreement: agreement(engineRaw, oracle),
    loadAverage: load,
  };
  const f = (ms: number): string => `${ms.toFixed(ms < 10 ? 2 : 1)} ms`;
  log('Lineup engine benchmark (one site at 44.3 N, galactic centre, frame 150 +- 25 deg, 3..28 deg, Moon down)');
  log(`  load average (1 min)               ${load.toFixed(2)} on this machine`);
  log(`  oracle, 1 target x 1 year          ${(oracleYearMs / 1000).toFixed(2)} s (minute steps, exact positions)`);
  log(`  engine, same search, warm median   ${f(year.median)} (fastest ${f(year.min)})`);
  log(`  ratio oracle / engine              ${figures.ratio.toFixed(0)} x`);
  log(`  engine, 1 target x 10 years        ${f(ten.median)}`);
  log(`  engine, 20 targets x 1 year        ${f(twenty.median)} (${(twenty.median / year.median).toFixed(2)} x one target)`);
  log(`  dark windows, 1 site-year          ${f(dark.median)}`);
  log(`  engine, first search (cold tables) ${f(engineYearColdMs)}; 10 years with tables cleared ${f(engineTenYearsColdTablesMs)}`);
  log(`  agreement on 2027: engine ${figures.agreement.engineLineups} / oracle ${figures.agreement.oracleLineups} lineups of 2 min or more, worst boundary ${figures.agreement.worstBoundaryS.toFixed(2)} s`);
  return figures;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await runEngineBench();
}
