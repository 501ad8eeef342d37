/**
 * The e-mail a watch sends for one lineup: plain text and HTML (dark background, red accents,
 * one column that reads on a phone), with the night's times in the site's time zone, and the sky
 * outlook of the lineup window (with a "still clear?" line when it changed a lot since the last
 * e-mail for the lineup).
 */
import { DateTime } from 'luxon';
import type { Lineup } from '../../shared/schemas/lineup';
import { moonIllumination } from '../../shared/sky/positions';
import { formatLocalTime } from '../../shared/sky/timezone';
import { TIDE_CAUTION } from '../../shared/tide';
import { OUTLOOK_CAUTION, outlookLabel, outlookSummary, type WatchOutlookDecision } from '../../shared/outlook';
import type { SkyOutlook } from '../../shared/schemas/outlook';
import { escapeHtml } from '../../shared/html';
import { nightOf } from '../services/watch-timing';

/** Said with every computed lineup. */
export const LINEUP_CAUTION =
  'A computed lineup is a plan, not a promise: check the weather, the official tide table and local knowledge before you go, and tell someone where you are going.';

/** Darkness and cold: said in every e-mail, since the trip is at night. */
export const NIGHT_CAUTION =
  'You will be out in the dark: take a head torch with a red mode, warm layers and a charged phone, and know your way back in the dark.';

export interface WatchEmailCaution {
  kind: 'access' | 'tide' | 'hazard' | 'general';
  body: string;
}

export interface WatchEmailInput {
  sightlineName: string;
  timezone: string;
  targetName: string;
  lineup: Lineup;
  leadDays: number;
  /** The instant of sending (the scheduler's clock): "in 3 days" is counted from it. */
  now: Date;
  /** Whether the sightline has a tide rule (the tide caution is shown then). */
  hasTideRule: boolean;
  /** The sightline's field notes that warn: hazard, tide and access notes. */
  cautions: readonly WatchEmailCaution[];
  links: { nightChart: string; unsubscribe: string; watches: string };
  /** The sky outlook of the lineup window; omitted, the e-mail says nothing of the sky. */
  outlook?: WatchEmailOutlook;
}

/** The sky outlook an e-mail shows, and how the watch judged it. */
export interface WatchEmailOutlook {
  outlook: SkyOutlook;
  /** The watch's cloud limit, %; null for none. */
  maxCloudPct: number | null;
  decision: WatchOutlookDecision;
  /** The outlook in the last e-mail sent for the lineup (what a change is measured from), or null. */
  earlier: SkyOutlook | null;
}

export interface RenderedWatchEmail {
  subject: string;
  text: string;
  html: string;
}

// Night-vision palette of the app's red theme (src/theme.ts).
const COLOURS = {
  page: '#000000',
  card: '#0c0201',
  text: '#e0442f',
  dim: '#a8301f',
  line: '#3a120c',
  button: '#c4321f',
  buttonText: '#000000',
};

function localClock(at: Date, tz: string): string {
  // formatLocalTime gives 'yyyy-MM-dd HH:mm LABEL', rounded to the minute.
  return formatLocalTime(at, tz).slice(11);
}

function whenText(night: string, now: Date, tz: string): string {
  const today = DateTime.fromJSDate(now, { zone: tz }).startOf('day');
  const days = Math.round(DateTime.fromISO(night, { zone: tz }).startOf('day').diff(today, 'days').days);
  if (days <= 0) return 'tonight';
  if (days === 1) return 'tomorrow night';
  return `in ${days} days`;
}

function moonText(l: Lineup): string {
  const phase = moonIllumination(new Date(l.peak)).phaseName;
  const lit = `${(l.moonIllumination * 100).toFixed(0)} % lit (${phase})`;
  return l.moonAltitudeDeg < 0
    ? `below the horizon (altitude ${l.moonAltitudeDeg.toFixed(1)}°), ${lit}`
    : `up at ${l.moonAltitudeDeg.toFixed(1)}°, ${lit}`;
}

function tideText(l: Lineup, tz: string, hasTideRule: boolean): string {
  if (!hasTideRule || !l.tideStatus) return 'no tide rule on this sightline';
  if (l.tideStatus === 'reachable') {
    return `reachable for the whole lineup by the tide times${l.tideCutOffAt ? `; cut off from ${localClock(new Date(l.tideCutOffAt), tz)}` : ''}`;
  }
  if (l.tideStatus === 'cut-off') return `CUT OFF by the tide during part of the lineup${l.tideCutOffAt ? ` (from ${localClock(new Date(l.tideCutOffAt), tz)})` : ''}`;
  return 'unknown: the tide times do not cover this night; paste the official table';
}

/** A forecast outlook in a few words: 'clear, 8 % cloud'; others by their label. */
function shortOutlook(o: SkyOutlook): string {
  return o.status === 'forecast' ? `${o.badge}, ${Math.round(o.meanCloudPct)} % cloud` : outlookLabel(o);
}

/** The rows, the "still clear?" line and the subject prefix of the sky outlook. */
function outlookParts(input: WatchEmailOutlook | undefined, tz: string): { rows: Array<[string, string]>; change: string | null; subjectPrefix: string } {
  if (!input) return { rows: [], change: null, subjectPrefix: '' };
  const { outlook: o, maxCloudPct, decision } = input;
  const rows: Array<[string, string]> = [['Sky outlook', outlookSummary(o)]];
  if (o.status === 'forecast') rows.push(['Forecast made', formatLocalTime(new Date(o.issuedAt), tz)]);
  if (o.status === 'no-forecast-yet' && o.issuedAt) rows.push(['Forecast made', formatLocalTime(new Date(o.issuedAt), tz)]);
  if (maxCloudPct !== null) {
    const limit = `at most ${maxCloudPct} % cloud`;
    const verdict = decision.reason === 'met' ? `${limit}: within it`
      : decision.reason === 'unknown' ? `${limit}: the outlook is unknown, so this e-mail is sent anyway`
        : decision.reason === 'changed' ? `${limit}: cloudier now; sent because the outlook changed a lot since the last e-mail`
          : limit;
    rows.push(['Your cloud limit', verdict]);
  }
  const change = decision.change;
  const earlier = input.earlier;
  if (!decision.changedALot || !change || earlier?.status !== 'forecast' || o.status !== 'forecast') return { rows, change: null, subjectPrefix: '' };
  const cloudier = (change.meanCloudChangePct ?? 0) > 0;
  const then = `${shortOutlook(earlier)} (forecast made ${formatLocalTime(new Date(earlier.issuedAt), tz)})`;
  const text = `${cloudier ? 'Still clear? No: the' : 'Clearer now: the'} sky outlook changed a lot since our last e-mail: then ${then}, now ${shortOutlook(o)}.`;
  const subjectPrefix = cloudier ? `Still clear? Now ${shortOutlook(o)}. ` : `Clearer now, ${Math.round(o.meanCloudPct)} % cloud. `;
  return { rows, change: text, subjectPrefix };
}

/** The subject, plain text and HTML of a watch e-mail. */
export function renderWatchEmail(input: WatchEmailInput): RenderedWatchEmail {
  const { lineup: l, timezone: tz } = input;
  const start = new Date(l.start);
  const nightIso = nightOf(start, tz);
  const night = DateTime.fromISO(nightIso, { zone: tz });
  const nightName = night.setLocale('en-GB').toFormat('cccc d LLLL yyyy');
  const when = whenText(nightIso, input.now, tz);
  const startText = formatLocalTime(start, tz);
  const sky = outlookParts(input.outlook, tz);
  const subject = `${sky.subjectPrefix}Lineup ${when}: ${input.targetName} at ${input.sightlineName}, ${night.setLocale('en-GB').toFormat('ccc d LLL')} ${localClock(start, tz)}`;

  const rows: Array<[string, string]> = [
    ['Night', `${nightName} (times in ${tz})`],
    ['Start', startText],
    ['Peak', formatLocalTime(new Date(l.peak), tz)],
    ['End', formatLocalTime(new Date(l.end), tz)],
    ['Duration', `${l.durationMin.toFixed(0)} min, score ${(l.score * 100).toFixed(0)} %`],
    [`${input.targetName} at the peak`, `altitude ${l.peakAltitudeDeg.toFixed(1)}°, azimuth ${l.peakAzimuthDeg.toFixed(1)}° (true north)`],
    ['Moon', moonText(l)],
    ['Sun at the peak', `${l.sunAltitudeDeg.toFixed(1)}°`],
    ['Tide', tideText(l, tz, input.hasTideRule)],
    ...sky.rows,
  ];
  const cautions = [
    ...input.cautions.map((c) => `${c.kind === 'hazard' ? 'Hazard' : c.kind === 'tide' ? 'Tide' : c.kind === 'access' ? 'Access' : 'Note'}: ${c.body}`),
    ...(input.hasTideRule ? [TIDE_CAUTION] : []),
    ...(input.outlook ? [OUTLOOK_CAUTION] : []),
    NIGHT_CAUTION,
    LINEUP_CAUTION,
  ];
  const footer = `You get this because you watch ${input.sightlineName} for ${input.targetName}, ${input.leadDays === 0 ? 'on the day' : `${input.leadDays} day${input.leadDays === 1 ? '' : 's'} ahead`}.`;

  const text = [
    `${input.targetName} lines up at ${input.sightlineName} ${when}.`,
    ...(sky.change ? ['', sky.change] : []),
    '',
    ...rows.map(([k, v]) => `${k}: ${v}`),
    `UTC: ${l.start.slice(0, 16).replace('T', ' ')} to ${l.end.slice(0, 16).replace('T', ' ')}`,
    '',
    'Cautions',
    ...cautions.map((c) => `- ${c}`),
    '',
    `Night chart: ${input.links.nightChart}`,
    `Your watches: ${input.links.watches}`,
    '',
    footer,
    `Pause this watch (no sign-in needed): ${input.links.unsubscribe}`,
    '',
  ].join('\n');

  const c = COLOURS;
  const cell = `padding:6px 0;border-bottom:1px solid ${c.line};vertical-align:top;`;
  const html = `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="color-scheme" content="dark"><meta name="supported-color-schemes" content="dark">
<title>${escapeHtml(subject)}</title></head>
<body style="margin:0;padding:0;background:${c.page};color:${c.text};font-family:-apple-system,'Segoe UI',Roboto,Helvetica,Arial,sans-serif;font-size:16px;line-height:1.45;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="background:${c.page};"><tr><td align="center" style="padding:16px 8px;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="max-width:560px;background:${c.card};border:1px solid ${c.line};border-radius:8px;">
<tr><td style="padding:18px 18px 4px 18px;color:${c.dim};font-size:13px;letter-spacing:0.08em;text-transform:uppercase;">Gnomon watch</td></tr>
<tr><td style="padding:0 18px 8px 18px;"><h1 style="margin:0;font-size:22px;line-height:1.25;color:${c.text};font-weight:600;">${escapeHtml(input.targetName)} lines up at ${escapeHtml(input.sightlineName)} ${escapeHtml(when)}</h1></td></tr>
${sky.change ? `<tr><td style="padding:0 18px 8px 18px;"><p style="margin:0;padding:10px 12px;border:1px solid ${c.button};border-radius:6px;color:${c.text};font-weight:600;">${escapeHtml(sky.change)}</p></td></tr>\n` : ''}<tr><td style="padding:4px 18px 12px 18px;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="color:${c.text};font-size:15px;">
${rows.map(([k, v]) => `<tr><td style="${cell}color:${c.dim};width:38%;padding-right:8px;">${escapeHtml(k)}</td><td style="${cell}">${escapeHtml(v)}</td></tr>`).join('\n')}
</table></td></tr>
<tr><td align="center" style="padding:8px 18px 16px 18px;"><a href="${escapeHtml(input.links.nightChart)}" style="display:inline-block;background:${c.button};color:${c.buttonText};text-decoration:none;font-weight:600;padding:12px 20px;border-radius:6px;">Open the night chart</a></td></tr>
<tr><td style="padding:0 18px 12px 18px;"><h2 style="margin:0 0 6px 0;font-size:16px;color:${c.text};">Cautions</h2>
<ul style="margin:0;padding-left:20px;color:${c.text};font-size:15px;">
${cautions.map((x) => `<li style="margin:0 0 6px 0;">${escapeHtml(x)}</li>`).join('\n')}
</ul></td></tr>
<tr><td style="padding:8px 18px 18px 18px;border-top:1px solid ${c.line};color:${c.dim};font-size:13px;">
${escapeHtml(footer)}<br>
<a href="${escapeHtml(input.links.unsubscribe)}" style="color:${c.dim};">Pause this watch</a> (no sign-in needed) &middot; <a href="${escapeHtml(input.links.watches)}" style="color:${c.dim};">Your watches</a>
</td></tr>
</table></td></tr></table>
</body></html>
`;
  return { subject, text, html };
}
