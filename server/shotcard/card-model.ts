/**
 * The content of a shot card, built once from a shot plan and drawn by both renderers (HTML and
 * PDF), so the two always say the same: headings, label/value rows, the timeline bar, the bearing
 * sketch, warnings and cautions. Every time is written in the site's zone.
 */
import { DateTime } from 'luxon';
import { localClock, localHourTicks, zoneLabelAt, type HourTick } from '../../shared/chart/localTime';
import { formatDecimalDegrees } from '../../shared/geo/coordinates';
import type { ShotPlan } from '../../shared/schemas/shot-plan';
import type { BarBlockInput, BarEventInput } from '../../shared/shotplan/sketch';
import { PLAN_NOT_PROMISE } from '../../shared/shotplan/cautions';

/** One label/value line; `warn` marks it for red. */
export interface CardRow {
  label: string;
  value: string;
  warn?: boolean;
}

/** A titled block of rows and free lines. */
export interface CardSection {
  id: 'times' | 'where' | 'gear' | 'framing' | 'exposure' | 'panorama' | 'timeline';
  title: string;
  rows: CardRow[];
  lines?: string[];
}

/** The bearing sketch: north up, the vantage in the middle, the landmark along the true bearing. */
export interface BearingSketch {
  trueDeg: number;
  magneticDeg: number;
  declinationDeg: number;
  distanceText: string;
}

/** Everything a shot card shows. */
export interface ShotCardModel {
  title: string;
  subtitle: string;
  zoneLine: string;
  headline: string;
  sections: CardSection[];
  /** What the timeline bar shows; each renderer lays it out for its own width (timelineBarLayout). */
  bar: { events: BarEventInput[]; blocks: BarBlockInput[]; timeZone: string };
  /** Short labels of the bar's events ('Dark 23:01'), same order as bar.events. */
  barEventLabels: string[];
  sketch: BearingSketch;
  warnings: string[];
  cautions: string[];
  fieldNotes: Array<{ kind: string; body: string }>;
  footer: string;
}

const SHORT_EVENT_LABELS: Record<string, string> = {
  'astronomical-dusk': 'Dark',
  'lineup-start': 'Start',
  'lineup-peak': 'Peak',
  'lineup-end': 'End',
  moonrise: 'Moon',
  'tide-cut-off': 'Tide',
  'astronomical-dawn': 'Dawn',
};

/** Full local hours across a bar's span, every 1, 2, 3, 4, 6 or 12 h so that at most 12 show. */
export function barHours(startMs: number, endMs: number, timeZone: string): HourTick[] {
  const hours = (endMs - startMs) / 3_600_000;
  const every = [1, 2, 3, 4, 6, 12].find((n) => hours / n <= 12) ?? 12;
  return localHourTicks(startMs, endMs, timeZone, every);
}

/** '156.0°' */
export function degrees(value: number, decimals = 1): string {
  return `${value.toFixed(decimals)}°`;
}

/** '20.8 s': an exposure limit to a tenth of a second. */
export function exposureSeconds(seconds: number): string {
  return `${seconds.toFixed(1)} s`;
}

/** '11 s', '1.5 s': an exposure as set on the camera. */
function settingSeconds(seconds: number): string {
  return `${Number.isInteger(seconds) ? seconds : seconds.toFixed(1)} s`;
}

/** '6 min 02 s', '1 h 05 min', '45 s'. */
export function duration(seconds: number): string {
  const s = Math.round(seconds);
  if (s < 60) return `${s} s`;
  if (s < 3600) return `${Math.floor(s / 60)} min ${String(s % 60).padStart(2, '0')} s`;
  const m = Math.round(s / 60);
  return `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, '0')} min`;
}

/** '02:27 BST' in the site's zone. */
export function clockWithZone(iso: string, timeZone: string): string {
  const d = new Date(iso);
  return `${localClock(d, timeZone)} ${zoneLabelAt(d, timeZone)}`;
}

/** 'Fri 30 Apr/1 May 2027': the night by its evening and the morning after. */
export function nightText(date: string): string {
  const evening = DateTime.fromISO(date, { zone: 'UTC' });
  const morning = evening.plus({ days: 1 });
  if (morning.month === evening.month) return `${evening.toFormat('ccc d')}/${morning.toFormat('d LLL yyyy')}`;
  if (morning.year === evening.year) return `${evening.toFormat('ccc d LLL')}/${morning.toFormat('d LLL yyyy')}`;
  return `${evening.toFormat('ccc d LLL yyyy')}/${morning.toFormat('d LLL yyyy')}`;
}

function distanceText(m: number): string {
  return m >= 1000 ? `${(m / 1000).toFixed(2)} km` : `${Math.round(m)} m`;
}

function eastWest(declinationDeg: number): string {
  return `${Math.abs(declinationDeg).toFixed(1)}° ${declinationDeg >= 0 ? 'E' : 'W'}`;
}

const ORIENTATION_WORD = { landscape: 'landscape', portrait: 'portrait' } as const;

/**
 * The shot card's content for a plan.
 * @param plan - a shot plan (shared/shotplan buildShotPlan)
 * @returns the model both renderers draw
 */
export function shotCardModel(plan: ShotPlan): ShotCardModel {
  const tz = plan.timezone;
  const at = (iso: string) => clockWithZone(iso, tz);
  const zone = zoneLabelAt(new Date(plan.lineup.start), tz);
  const { gear, framing, exposure, panorama, timeline } = plan;
  const warnedBlocks = new Set(timeline.warnings.map((w) => w.blockIndex));

  const times: CardSection = {
    id: 'times',
    title: 'Times (site time)',
    rows: timeline.events.map((e) => ({ label: e.label, value: at(e.at), warn: e.kind === 'tide-cut-off' || e.kind === 'moonrise' })),
    lines: [`Moon ${Math.round(plan.moon.illuminatedFraction * 100)} % lit at midnight (${plan.moon.phaseName})`],
  };
  if (plan.tide) {
    times.rows.push({ label: 'Tide status', value: plan.tide.status === 'reachable' ? 'reachable for the whole lineup' : plan.tide.status === 'cut-off' ? 'CUT OFF during the lineup' : 'not covered by the tide times', warn: plan.tide.status !== 'reachable' });
  }

  const where: CardSection = {
    id: 'where',
    title: 'Where',
    rows: [
      { label: 'Vantage', value: formatDecimalDegrees({ lat: plan.site.lat, lon: plan.site.lon }, 5) },
      { label: 'Landmark', value: formatDecimalDegrees(plan.landmark, 5) },
      { label: 'Distance', value: distanceText(plan.bearing.distanceM) },
      { label: 'Bearing (true)', value: degrees(plan.bearing.trueDeg) },
      {
        label: 'Bearing (magnetic)',
        value: `${degrees(plan.bearing.magneticDeg)} (declination ${eastWest(plan.bearing.declinationDeg)})`,
        warn: !plan.bearing.compassReliable,
      },
      { label: 'Landmark top', value: `alt ${degrees(plan.landmarkView.topAltDeg)}` },
    ],
  };

  const gearSection: CardSection = {
    id: 'gear',
    title: 'Gear and settings',
    rows: [
      { label: 'Body', value: `${gear.body.name} (${gear.body.sensorWidthMm} × ${gear.body.sensorHeightMm} mm, crop ${gear.body.cropFactor.toFixed(2)}, ${gear.body.pixelPitchUm.toFixed(2)} µm)` },
      { label: 'Lens', value: `${gear.lens.name} (${gear.lens.isZoom ? `${gear.lens.minMm}–${gear.lens.maxMm} mm` : `${gear.lens.minMm} mm`}, f/${gear.lens.widestApertureF})` },
      { label: 'Focal length', value: `${gear.focalLengthMm} mm` },
      { label: 'Aperture', value: `f/${gear.fNumber}` },
      { label: 'Sky', value: gear.tracked ? 'tracked' : 'untracked', warn: gear.tracked && !gear.starTrackerAvailable },
    ],
  };

  const fitText = framing.fitsIn.length === 2
    ? 'fits in landscape and in portrait'
    : framing.fitsIn.length === 1 ? `fits in ${framing.fitsIn[0]} only` : 'does not fit in one frame';
  const aimAt = framing.fitsIn[0] ? framing[framing.fitsIn[0]] : null;
  const framingSection: CardSection = {
    id: 'framing',
    title: 'Framing',
    rows: [
      { label: 'Field of view', value: `${degrees(framing.fov.horizontalDeg)} × ${degrees(framing.fov.verticalDeg)} (diagonal ${degrees(framing.fov.diagonalDeg)})` },
      { label: 'Landmark + path', value: fitText, warn: framing.fitsIn.length === 0 },
      {
        label: 'Longest that fits',
        value: framing.longestFitting.focalLengthMm === null
          ? 'none of this lens: shoot a panorama'
          : `${framing.longestFitting.focalLengthMm.toFixed(0)} mm ${framing.longestFitting.orientation ? ORIENTATION_WORD[framing.longestFitting.orientation] : ''}`.trim(),
      },
    ],
  };
  if (aimAt?.centre) {
    framingSection.rows.push({ label: `Aim (${aimAt.orientation})`, value: `az ${degrees(aimAt.centre.azimuthDeg)}, alt ${degrees(aimAt.centre.altitudeDeg)}, level` });
  }

  const sky = exposure.sky;
  const exposureSection: CardSection = {
    id: 'exposure',
    title: 'Exposure',
    rows: [
      { label: '500 rule', value: exposureSeconds(exposure.untracked.rule500S) },
      { label: 'NPF rule', value: exposureSeconds(exposure.untracked.npfSimpleS) },
      ...(exposure.untracked.npfFullS !== null ? [{ label: `NPF full (dec ${degrees(plan.target.decDeg)})`, value: exposureSeconds(exposure.untracked.npfFullS) }] : []),
      { label: 'Tracked subs', value: `${exposure.trackedSubRange.minS}–${exposure.trackedSubRange.maxS} s at ${gear.focalLengthMm} mm (common practice)` },
      {
        label: sky.tracked ? 'Sky stack (tracked)' : 'Sky stack',
        value: `${sky.frames} × ${settingSeconds(sky.subExposureS)} = ${duration(sky.frames * sky.subExposureS)} exposure, ${duration(sky.durationS)} in all`,
      },
      {
        label: 'Time available',
        value: `${duration(sky.available.seconds)} until ${sky.available.limitedBy === 'moonrise' ? 'moonrise' : 'the lineup ends'} (${at(sky.available.until)})`,
        warn: !sky.fits,
      },
      ...(!sky.fits ? [{ label: 'In time', value: `${sky.framesInTime} of ${sky.frames} frames (${duration(sky.integrationInTimeS)})`, warn: true }] : []),
      ...(exposure.foreground.frames > 0 ? [{ label: 'Foreground', value: `${exposure.foreground.frames} × ${settingSeconds(exposure.foreground.exposureS)}` }] : []),
    ],
  };

  const sections: CardSection[] = [times, where, gearSection, framingSection, exposureSection];

  if (panorama) {
    const totalAz = panorama.field.fullCircle ? '360°' : degrees(panorama.field.azimuthDeg, 0);
    sections.push({
      id: 'panorama',
      title: 'Panorama grid',
      rows: [
        { label: 'Grid', value: `${panorama.rowCount} row${panorama.rowCount === 1 ? '' : 's'} × up to ${panorama.maxColumns} (${panorama.frameCount} frames), ${Math.round(panorama.overlap * 100)} % overlap, ${panorama.orientation}` },
        { label: 'Field', value: `${totalAz} wide, alt ${degrees(panorama.field.bottomAltDeg, 0)} to ${degrees(panorama.field.topAltDeg, 0)}` },
        { label: 'Each frame', value: `${settingSeconds(panorama.frameExposureS)}, ${settingSeconds(panorama.frameGapS)} to turn` },
      ],
      lines: [
        ...panorama.rows.map((r) => {
          const frames = panorama.frames.filter((f) => f.row === r.index);
          const first = frames[0];
          const last = frames[frames.length - 1];
          const az = first && last && frames.length > 1
            ? `az ${degrees(first.azimuthDeg)} to ${degrees(last.azimuthDeg)} every ${degrees(r.azimuthStepDeg)}`
            : `az ${degrees(first?.azimuthDeg ?? 0)}`;
          return `Row ${r.index + 1} at alt ${degrees(r.altitudeDeg)}: ${r.columns} frame${r.columns === 1 ? '' : 's'}, ${az}`;
        }),
        ...(panorama.note ? [panorama.note] : []),
      ],
    });
  }

  sections.push({
    id: 'timeline',
    title: 'Shooting order',
    rows: timeline.blocks.map((b) => ({
      label: `${localClock(new Date(b.start), tz)}–${at(b.end)}`,
      value: `${b.label}, ${duration(b.durationS)}`,
      warn: warnedBlocks.has(b.index),
    })),
  });

  const bar = {
    events: timeline.events.map((e) => ({ kind: e.kind, label: e.label, atMs: Date.parse(e.at) })),
    blocks: timeline.blocks.map((b) => ({ kind: b.kind, label: b.label, startMs: Date.parse(b.start), endMs: Date.parse(b.end), late: warnedBlocks.has(b.index) })),
    timeZone: tz,
  };
  const warnings = timeline.warnings.map((w) => w.message);
  const warningSet = new Set(warnings);

  return {
    title: `Shot card: ${plan.sightline.name}`,
    subtitle: `${plan.target.name} · night of ${nightText(plan.night)}`,
    zoneLine: `All times are local at the site: ${tz} (${zone})`,
    headline: `Lineup ${localClock(new Date(plan.lineup.start), tz)}–${at(plan.lineup.end)}, peak ${at(plan.lineup.peak)}`,
    sections,
    bar,
    barEventLabels: bar.events.map((e) => `${SHORT_EVENT_LABELS[e.kind] ?? e.label} ${localClock(new Date(e.atMs), tz)}`),
    sketch: { trueDeg: plan.bearing.trueDeg, magneticDeg: plan.bearing.magneticDeg, declinationDeg: plan.bearing.declinationDeg, distanceText: distanceText(plan.bearing.distanceM) },
    warnings,
    cautions: plan.cautions.filter((c) => !warningSet.has(c) && c !== PLAN_NOT_PROMISE),
    fieldNotes: plan.fieldNotes,
    footer: `${PLAN_NOT_PROMISE} Made by Gnomon on ${DateTime.fromISO(plan.generatedAt, { zone: tz }).toFormat('d LLL yyyy HH:mm')} ${zoneLabelAt(new Date(plan.generatedAt), tz)}.`,
  };
}
