import ical from 'ical-generator';
import type { LineupSearchResponse } from '../../shared/schemas/lineup';
import { formatLocalTime } from '../../shared/sky/timezone';
import { nightOf } from './watch-timing';

const CAUTION = 'A computed lineup is a plan, not a promise: check the weather, the official tide table and local knowledge before you go.';

function describe(l: LineupSearchResponse['lineups'][number], tz: string): string {
  return [
    `Peak ${formatLocalTime(new Date(l.peak), tz)}: azimuth ${l.peakAzimuthDeg.toFixed(1)} deg, altitude ${l.peakAltitudeDeg.toFixed(1)} deg`,
    `Moon ${l.moonAltitudeDeg.toFixed(1)} deg, ${(l.moonIllumination * 100).toFixed(0)} % lit`,
    `Score ${(l.score * 100).toFixed(0)} %`,
    ...(l.tideStatus ? [`Tide: ${l.tideStatus}${l.tideCutOffAt ? `, cut off at ${formatLocalTime(new Date(l.tideCutOffAt), tz)}` : ''}`] : []),
    CAUTION,
  ].join('\n');
}

/** The lineups as an iCalendar file (events in UTC; local times in the description). */
export function lineupsToIcs(result: LineupSearchResponse, title: string): string {
  const calendar = ical({ name: title, prodId: { company: 'Gnomon', product: 'lineups', language: 'EN' } });
  for (const l of result.lineups) {
    calendar.createEvent({
      id: `${l.start}-${result.target.id ?? result.target.name}@gnomon`,
      start: new Date(l.start),
      end: new Date(l.end),
      summary: `Lineup: ${result.target.name} (${title})`,
      description: describe(l, result.timezone),
    });
  }
  return calendar.toString();
}

function csvField(value: string | number): string {
  const text = String(value);
  return /[",\n\r]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The lineups as CSV, one row a lineup, local and UTC times. */
export function lineupsToCsv(result: LineupSearchResponse): string {
  const tz = result.timezone;
  const header = ['night', 'start_local', 'end_local', 'peak_local', 'timezone', 'start_utc', 'end_utc', 'peak_utc', 'duration_min',
    'peak_azimuth_deg', 'peak_altitude_deg', 'moon_altitude_deg', 'moon_illumination', 'score', 'tide_status', 'target'];
  const rows = result.lineups.map((l) => [
    // The night is named by the local date of its evening: a lineup after midnight belongs to the day before.
    nightOf(new Date(l.start), tz),
    formatLocalTime(new Date(l.start), tz), formatLocalTime(new Date(l.end), tz), formatLocalTime(new Date(l.peak), tz), tz,
    l.start, l.end, l.peak, l.durationMin.toFixed(1), l.peakAzimuthDeg.toFixed(2), l.peakAltitudeDeg.toFixed(2),
    l.moonAltitudeDeg.toFixed(2), l.moonIllumination.toFixed(3), l.score.toFixed(3), l.tideStatus ?? '', result.target.name,
  ]);
  return [header, ...rows].map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}
