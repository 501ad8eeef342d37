/**
 * The sky outlook in words, the same in the planner (badge and tooltip), on the night chart and
 * in watch e-mails: a short label, a one-line summary and the numbers as label/value pairs.
 * Percentages are shown whole, wind in m/s with one decimal, times in the site's zone.
 */
import { formatLocalTime } from '../sky/timezone';
import type { ForecastHour, ForecastOutlook, SkyOutlook } from '../schemas/outlook';

/** One line of an outlook's numbers. */
export interface OutlookFact {
  label: string;
  value: string;
}

const pct = (v: number) => `${Math.round(v)} %`;
const ms = (v: number) => `${v.toFixed(1)} m/s`;

function maxOf(hours: readonly ForecastHour[], pick: (h: ForecastHour) => number | null): number | null {
  let best: number | null = null;
  for (const h of hours) {
    const v = pick(h);
    if (v !== null && (best === null || v > best)) best = v;
  }
  return best;
}

function instantText(iso: string, timeZone: string): string {
  return formatLocalTime(new Date(iso), timeZone);
}

/**
 * The outlook's short label: its badge ('clear', 'mixed', 'cloudy') for a forecast, else
 * 'no forecast yet', 'forecast unavailable' or 'lineup over'.
 *
 * @param outlook - the outlook of a lineup window
 * @returns the label, lower case
 */
export function outlookLabel(outlook: SkyOutlook): string {
  switch (outlook.status) {
    case 'forecast': return outlook.badge;
    case 'no-forecast-yet': return 'no forecast yet';
    case 'unavailable': return 'forecast unavailable';
    case 'past': return 'lineup over';
  }
}

/**
 * The outlook in one line, e.g. "clear: mean cloud 8 % (highest hour 20 %), dew risk low" or
 * "forecast unavailable: The forecast service did not answer in time".
 *
 * @param outlook - the outlook of a lineup window
 * @returns the summary
 */
export function outlookSummary(outlook: SkyOutlook): string {
  switch (outlook.status) {
    case 'forecast': {
      const partly = outlook.complete ? '' : ` over ${outlook.hoursCovered} of ${outlook.hoursInWindow} hours`;
      return `${outlook.badge}: mean cloud ${pct(outlook.meanCloudPct)} (highest hour ${pct(outlook.maxCloudPct)})${partly}, dew risk ${outlook.dewRisk}`;
    }
    case 'no-forecast-yet': return 'no forecast yet: the lineup is beyond the forecast\'s reach';
    case 'unavailable': return `forecast unavailable: ${outlook.message}`;
    case 'past': return 'lineup over';
  }
}

function forecastFacts(o: ForecastOutlook, timeZone: string): OutlookFact[] {
  const facts: OutlookFact[] = [{ label: 'Cloud', value: `mean ${pct(o.meanCloudPct)}, highest hour ${pct(o.maxCloudPct)}` }];
  const layers = [maxOf(o.hours, (h) => h.cloudCoverLowPct), maxOf(o.hours, (h) => h.cloudCoverMidPct), maxOf(o.hours, (h) => h.cloudCoverHighPct)];
  if (layers.some((v) => v !== null)) {
    facts.push({ label: 'Low / mid / high', value: `up to ${layers.map((v) => (v === null ? '–' : pct(v))).join(' / ')}` });
  }
  if (o.maxPrecipitationProbabilityPct !== null) facts.push({ label: 'Rain chance', value: `up to ${pct(o.maxPrecipitationProbabilityPct)}` });
  if (o.maxWindSpeedMs !== null || o.maxWindGustsMs !== null) {
    const parts = [o.maxWindSpeedMs !== null ? `up to ${ms(o.maxWindSpeedMs)}` : null, o.maxWindGustsMs !== null ? `gusts ${ms(o.maxWindGustsMs)}` : null];
    facts.push({ label: 'Wind', value: parts.filter((p) => p !== null).join(', ') });
  }
  if (o.maxRelativeHumidityPct !== null) facts.push({ label: 'Humidity', value: `up to ${pct(o.maxRelativeHumidityPct)}` });
  const spread = o.minDewPointSpreadC === null ? '' : `, air within ${o.minDewPointSpreadC.toFixed(1)} °C of its dew point`;
  facts.push({ label: 'Dew risk', value: `${o.dewRisk}${spread}` });
  if (!o.complete) facts.push({ label: 'Covers', value: `${o.hoursCovered} of the window's ${o.hoursInWindow} hours (the forecast ends inside it)` });
  facts.push({ label: 'Forecast made', value: instantText(o.issuedAt, timeZone) });
  return facts;
}

/**
 * The outlook's numbers as label/value pairs: cloud (mean and highest hour), low/mid/high cloud,
 * rain chance, wind and gusts, humidity, dew risk with the dew point spread, and when the forecast
 * was made, in the site's zone. Fields the service did not give are left out.
 *
 * @param outlook - the outlook of a lineup window
 * @param timeZone - IANA zone of the site, for the forecast's issue time
 * @returns the pairs, in display order
 * @throws RangeError on an invalid zone
 */
export function outlookFacts(outlook: SkyOutlook, timeZone: string): OutlookFact[] {
  switch (outlook.status) {
    case 'forecast':
      return forecastFacts(outlook, timeZone);
    case 'no-forecast-yet': {
      const facts: OutlookFact[] = [{
        label: 'Forecast',
        value: outlook.horizonEnd ? `not yet: it reaches to ${instantText(outlook.horizonEnd, timeZone)}` : 'not yet: the lineup is beyond the forecast\'s reach',
      }];
      if (outlook.issuedAt) facts.push({ label: 'Forecast made', value: instantText(outlook.issuedAt, timeZone) });
      return facts;
    }
    case 'unavailable':
      return [{ label: 'Forecast', value: `unavailable: ${outlook.message}` }];
    case 'past':
      return [{ label: 'Forecast', value: 'none: the lineup is over' }];
  }
}
