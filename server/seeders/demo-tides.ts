/**
 * Invented tide times for the demo sightlines only: a regular semidiurnal pattern (lows and highs
 * alternating every half lunar day, heights swinging with a spring-neap cycle). They look like a
 * table but predict nothing; the demo's field notes say so.
 */
import { DateTime } from 'luxon';

const HALF_TIDE_MS = (12 * 60 + 25.2) * 60_000 / 2; // half of the principal lunar semidiurnal period
const SPRING_NEAP_DAYS = 14.77;

export interface DemoTideOptions {
  /** First local day of the table (ISO date), in the zone. */
  startDate: string;
  days: number;
  timeZone: string;
  /** Local time of the first low water, minutes after midnight. */
  firstLowMinutes: number;
  meanRangeM: number;
}

/** Lines as a user would paste them: `YYYY-MM-DD HH:MM L|H height`, local times. */
export function demoTideLines(o: DemoTideOptions): string[] {
  const start = DateTime.fromISO(o.startDate, { zone: o.timeZone }).startOf('day');
  const end = start.plus({ days: o.days });
  const lines: string[] = [];
  let t = start.plus({ minutes: o.firstLowMinutes }).toMillis();
  for (let i = 0; t < end.toMillis(); i += 1, t += HALF_TIDE_MS) {
    const days = (t - start.toMillis()) / 86_400_000;
    const range = o.meanRangeM * (1 + 0.3 * Math.cos((2 * Math.PI * days) / SPRING_NEAP_DAYS));
    const low = i % 2 === 0;
    const height = low ? 0.5 + (o.meanRangeM - range) / 4 : 0.5 + range;
    const local = DateTime.fromMillis(t, { zone: o.timeZone });
    lines.push(`${local.toFormat('yyyy-MM-dd HH:mm')} ${low ? 'L' : 'H'} ${height.toFixed(1)}`);
  }
  return lines;
}
