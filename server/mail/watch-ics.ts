/**
 * iCalendar events of watched lineups (ical-generator, as the lineup export): one event for an
 * e-mail's attachment, many for a user's calendar feed. Events are in UTC; the description gives
 * the site's local times. An event's UID depends on the watch and the lineup start only, so the
 * attachment and the feed describe the same event and a calendar app merges them.
 */
import ical, { ICalCalendarMethod } from 'ical-generator';
import type { Lineup } from '../../shared/schemas/lineup';
import { formatLocalTime } from '../../shared/sky/timezone';
import { deliveryLineupStart } from '../services/watch-timing';
import { LINEUP_CAUTION } from './watch-email';

export interface WatchedLineupEvent {
  watchId: string;
  sightlineName: string;
  targetName: string;
  timezone: string;
  vantage: { lat: number; lon: number };
  lineup: Lineup;
  nightChartUrl: string;
}

/** UID of a watched lineup's event (stable across e-mails, feed fetches and restarts): the start is the whole-minute one. */
export function watchedLineupUid(watchId: string, lineupStart: Date): string {
  return `watch-${watchId}-${lineupStart.toISOString().replace(/[-:.]/g, '')}@gnomon`;
}

function description(e: WatchedLineupEvent): string {
  const l = e.lineup;
  const tz = e.timezone;
  return [
    `Start ${formatLocalTime(new Date(l.start), tz)}, peak ${formatLocalTime(new Date(l.peak), tz)}, end ${formatLocalTime(new Date(l.end), tz)} (${tz})`,
    `${e.targetName} at the peak: altitude ${l.peakAltitudeDeg.toFixed(1)} deg, azimuth ${l.peakAzimuthDeg.toFixed(1)} deg`,
    `Moon ${l.moonAltitudeDeg.toFixed(1)} deg, ${(l.moonIllumination * 100).toFixed(0)} % lit`,
    `Score ${(l.score * 100).toFixed(0)} %, ${l.durationMin.toFixed(0)} min`,
    ...(l.tideStatus ? [`Tide: ${l.tideStatus}`] : []),
    `Night chart: ${e.nightChartUrl}`,
    LINEUP_CAUTION,
  ].join('\n');
}

/**
 * An iCalendar file of watched lineups.
 * @param name calendar name
 * @param events the lineups with their sightline and target
 * @param method PUBLISH for an e-mail attachment; none for a subscribed feed
 */
export function watchedLineupsToIcs(name: string, events: readonly WatchedLineupEvent[], method?: 'PUBLISH'): string {
  const calendar = ical({
    name,
    prodId: { company: 'Gnomon', product: 'watches', language: 'EN' },
    ...(method ? { method: ICalCalendarMethod.PUBLISH } : {}),
    // A feed is polled: hint calendar apps to refresh it every few hours.
    ttl: 6 * 3600,
  });
  for (const e of events) {
    calendar.createEvent({
      id: watchedLineupUid(e.watchId, deliveryLineupStart(e.lineup)),
      start: new Date(e.lineup.start),
      end: new Date(e.lineup.end),
      summary: `Lineup: ${e.targetName} at ${e.sightlineName}`,
      description: description(e),
      location: { title: e.sightlineName, geo: { lat: e.vantage.lat, lon: e.vantage.lon } },
      url: e.nightChartUrl,
    });
  }
  return calendar.toString();
}
