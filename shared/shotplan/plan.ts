/**
 * The whole shot plan of one lineup, from the sightline, the target, the lineup's times, the chosen
 * body + lens and the settings: framing (field of view, one-frame fit, the longest focal length
 * that fits), a panorama grid when one frame is not enough, the untracked limits side by side,
 * the sky stack, and the night's timeline with deadline warnings and cautions. Pure: the caller
 * brings the stored sightline, gear and tide status; everything else is computed here from the
 * modules of shared/shotplan, shared/sky, shared/projection and shared/geo.
 */
import { nightDateOf } from '../chart/localTime';
import { sightlineGeometry } from '../geo/frame';
import { assertValidDate } from '../guards';
import { angularSeparationDeg, type SkyDirection } from '../projection/camera';
import { galacticPlaneHorizontal } from '../projection/overlay';
import { targetTrack } from '../projection/track';
import type { CameraBody, Lens } from '../schemas/gear';
import type { Landmark, Vantage } from '../schemas/geometry';
import {
  DEFAULT_TRACKED_INTEGRATION_S,
  DEFAULT_UNTRACKED_INTEGRATION_S,
  type PanoramaCover,
  type ShotPlan,
  type ShotPlanPanorama,
} from '../schemas/shot-plan';
import { nightReport } from '../sky/night';
import { targetHorizontal } from '../sky/positions';
import { formatLocalTime } from '../sky/timezone';
import { MS_PER_MINUTE, normalizeDegrees360 } from '../units';
import { shotPlanCautions } from './cautions';
import { framesForIntegration, MAX_NPF_DECLINATION_DEG, suggestedSubExposureRange, trackedStackPlan, untrackedLimits } from './exposure';
import { fitInFrame, heldFieldOfView, longestFittingFocalLength, type Orientation } from './framing';
import { deriveBody, lensFocalRange } from './gear';
import { DEFAULT_PANORAMA_OVERLAP, panoramaGrid, skySpanOf, type PanoramaGrid } from './panorama';
import { framesBlock, nightEventsFromReport, panoramaRowBlocks, planNight, type ShootingBlock } from './timeline';

/** A shot plan input that cannot be planned, with the dotted path of the request field to blame. */
export class ShotPlanInputError extends RangeError {
  override name = 'ShotPlanInputError';
  constructor(readonly field: string, message: string) {
    super(message);
  }
}

/** Most track samples used for framing: the target's path is sampled this finely at most. */
const TRACK_SAMPLES_TARGET = 48;
/** Galactic plane spacing for the sketch and the panorama cover, degrees of galactic longitude. */
const PLANE_STEP_DEG = 2;
/** Plane points at or above this altitude go to the sketch, degrees. */
const PLANE_SKETCH_MIN_ALT_DEG = -5;

/** Everything {@link buildShotPlan} needs. */
export interface ShotPlanInputs {
  sightline: { id: string; name: string; timezone: string; vantage: Vantage; landmark: Landmark; hasTideRule: boolean };
  target: { id?: string; name: string; raHours: number; decDeg: number };
  lineup: { start: Date; peak: Date; end: Date };
  body: CameraBody & { id: string };
  lens: Lens & { id: string };
  /** Default: the lens's shortest focal length. */
  focalLengthMm?: number;
  /** Default: the lens's widest aperture. */
  fNumber?: number;
  tracked: boolean;
  starTrackerAvailable: boolean;
  sky: { subExposureS?: number; totalIntegrationS?: number; frameGapS: number };
  foreground: { frames: number; exposureS: number; first: boolean };
  panorama: {
    mode: 'auto' | 'always' | 'off';
    overlap: number;
    orientation: Orientation;
    cover: PanoramaCover;
    skyTopAltDeg: number;
    frameExposureS?: number;
    frameGapS: number;
  };
  /** Default: the lineup start. */
  startAt?: Date;
  blockGapS: number;
  /** The lineup's tide status under the sightline's tide rule (null without a rule). */
  tide: { status: 'reachable' | 'cut-off' | 'unknown'; cutOffAt: Date | null } | null;
  /** Safety-relevant field notes of the sightline. */
  fieldNotes?: ReadonlyArray<{ kind: string; body: string }>;
  /** When the plan is made (default now). */
  now?: Date;
}

/**
 * An exposure rounded down to what a camera dial offers: whole seconds from 1 s, tenths below,
 * at least 0.1 s.
 * @param seconds - a limit, seconds, above 0
 * @returns the rounded exposure, seconds
 * @throws RangeError when seconds is not a finite number above 0
 */
export function roundDownExposureS(seconds: number): number {
  if (typeof seconds !== 'number' || !Number.isFinite(seconds) || !(seconds > 0)) {
    throw new RangeError(`seconds must be a finite number above 0 (got ${String(seconds)})`);
  }
  if (seconds >= 1) return Math.floor(seconds + 1e-9);
  return Math.max(0.1, Math.floor(seconds * 10 + 1e-9) / 10);
}

/**
 * The part of a loop of sky points (e.g. the galactic plane) that lies within an altitude band and
 * is nearest a direction: the loop is split into runs of consecutive points inside the band
 * (joined across the loop's end), and the run holding the point closest to `near` is returned.
 * @param loop - points in order round a closed loop (azimuth 0..360, altitude -90..90 deg), at most 10 000
 * @param minAltDeg - lowest altitude of the band, degrees -90..90
 * @param maxAltDeg - highest altitude of the band, degrees, at least minAltDeg
 * @param near - the direction the run should hold or come closest to
 * @returns the run's points in loop order (empty when no point lies in the band)
 * @throws RangeError on invalid input
 */
export function loopRunNear<T extends SkyDirection>(loop: readonly T[], minAltDeg: number, maxAltDeg: number, near: SkyDirection): T[] {
  if (!Array.isArray(loop)) throw new RangeError('loop must be an array');
  if (loop.length > 10_000) throw new RangeError(`loop may hold at most 10000 points (got ${loop.length})`);
  if (!(Number.isFinite(minAltDeg) && Number.isFinite(maxAltDeg) && minAltDeg >= -90 && maxAltDeg <= 90 && maxAltDeg >= minAltDeg)) {
    throw new RangeError(`the band must satisfy -90 <= minAltDeg <= maxAltDeg <= 90 (got ${minAltDeg}, ${maxAltDeg})`);
  }
  const inBand = (p: T) => p.altitudeDeg >= minAltDeg && p.altitudeDeg <= maxAltDeg;
  const firstOut = loop.findIndex((p) => !inBand(p));
  let runs: T[][];
  if (firstOut < 0) runs = loop.length ? [loop.slice()] : [];
  else {
    const rotated = [...loop.slice(firstOut), ...loop.slice(0, firstOut)];
    runs = [];
    let current: T[] = [];
    for (const p of rotated) {
      if (inBand(p)) current.push(p);
      else if (current.length) { runs.push(current); current = []; }
    }
    if (current.length) runs.push(current);
  }
  let best: T[] = [];
  let bestDistance = Infinity;
  for (const run of runs) {
    for (const p of run) {
      const d = angularSeparationDeg(p, near);
      if (d < bestDistance) { bestDistance = d; best = run; }
    }
  }
  return best;
}

function trackStepMinutes(durationMin: number): number {
  return Math.min(5, Math.max(0.5, durationMin / TRACK_SAMPLES_TARGET));
}

function field<T>(name: string, compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (error instanceof RangeError && !(error instanceof ShotPlanInputError)) throw new ShotPlanInputError(name, error.message);
    throw error;
  }
}

/**
 * The shot plan of a lineup (see the module header). Times in the result are ISO instants (UTC);
 * the site's zone is `timezone`, in which the cautions' clock times are written.
 * @param inputs - see {@link ShotPlanInputs}: a saved sightline (schema ranges), a J2000 target,
 *   the lineup's start <= peak <= end (at most 24 h), a body and lens that pass the gear schemas,
 *   a focal length inside the lens's range, an f-number no wider than the lens's widest, and the
 *   sky, foreground, panorama and timeline settings
 * @returns the plan
 * @throws ShotPlanInputError (a RangeError) naming the request field when the plan cannot be made
 *   (e.g. a focal length outside the lens, a stack longer than 12 h, a grid of more than 5000
 *   frames); RangeError on other invalid input
 */
export function buildShotPlan(inputs: ShotPlanInputs): ShotPlan {
  const i = inputs;
  const tz = i.sightline.timezone;
  const start = assertValidDate(i.lineup?.start, 'lineup.start');
  const peak = assertValidDate(i.lineup.peak, 'lineup.peak');
  const end = assertValidDate(i.lineup.end, 'lineup.end');
  if (!(end.getTime() > start.getTime())) throw new ShotPlanInputError('lineup.end', 'The lineup must end after it starts');
  if (peak < start || peak > end) throw new ShotPlanInputError('lineup.peak', 'The peak must lie between the start and the end');
  const now = i.now ?? new Date();

  // Gear.
  const derived = field('bodyId', () => deriveBody(i.body));
  const range = field('lensId', () => lensFocalRange(i.lens));
  const focalLengthMm = i.focalLengthMm ?? range.minMm;
  if (focalLengthMm < range.minMm - 1e-9 || focalLengthMm > range.maxMm + 1e-9) {
    throw new ShotPlanInputError('focalLengthMm', range.isZoom ? `This lens zooms from ${range.minMm} to ${range.maxMm} mm` : `This lens has a focal length of ${range.minMm} mm`);
  }
  const fNumber = i.fNumber ?? i.lens.widestApertureF;
  if (fNumber < i.lens.widestApertureF - 1e-9) throw new ShotPlanInputError('fNumber', `This lens opens to f/${i.lens.widestApertureF} at most`);
  const sensor = { widthMm: i.body.sensorWidthMm, heightMm: i.body.sensorHeightMm };

  // Where things are.
  const geometry = field('sightline', () => sightlineGeometry(i.sightline.vantage, i.sightline.landmark, peak));
  const v = i.sightline.vantage;
  const site = { lat: v.lat, lon: v.lon, elevationM: v.elevationM + v.cameraHeightM };
  const az = geometry.trueBearingDeg;
  const half = geometry.angularWidthDeg / 2;
  const landmarkPoints: SkyDirection[] = [
    { azimuthDeg: az, altitudeDeg: geometry.topElevationDeg },
    { azimuthDeg: az, altitudeDeg: geometry.baseElevationDeg },
  ];
  if (half > 0.05) {
    for (const side of [-half, half]) {
      const a = normalizeDegrees360(az + side);
      landmarkPoints.push({ azimuthDeg: a, altitudeDeg: geometry.topElevationDeg }, { azimuthDeg: a, altitudeDeg: geometry.baseElevationDeg });
    }
  }
  const durationMin = (end.getTime() - start.getTime()) / MS_PER_MINUTE;
  const track = field('lineup', () => targetTrack(i.target, site, start, end, trackStepMinutes(durationMin)));
  const trackPoints: SkyDirection[] = track.map((t) => ({ azimuthDeg: t.azimuthDeg, altitudeDeg: t.altitudeDeg }));
  const peakHorizontal = targetHorizontal(i.target, site, peak);
  const peakPosition: SkyDirection = { azimuthDeg: peakHorizontal.azimuthDeg, altitudeDeg: peakHorizontal.altitudeDeg };

  // Framing.
  const points = [...landmarkPoints, ...trackPoints];
  const fit = fitInFrame(points, sensor, focalLengthMm);
  const lensFit = longestFittingFocalLength(points, sensor, { minMm: range.minMm, maxMm: range.maxMm });

  // The galactic plane at the peak, for the sketch and a plane panorama.
  const plane = galacticPlaneHorizontal(site, peak, PLANE_STEP_DEG);

  // Exposure limits.
  const dec = i.target.decDeg;
  const untracked = untrackedLimits({
    focalLengthMm,
    fNumber,
    cropFactor: derived.cropFactor,
    pixelPitchUm: derived.pixelPitchUm,
    ...(Math.abs(dec) <= MAX_NPF_DECLINATION_DEG ? { declinationDeg: dec } : {}),
  });
  const untrackedFrameS = roundDownExposureS(Math.min(untracked.rule500S, untracked.npfSimpleS));
  const trackedSubRange = suggestedSubExposureRange(focalLengthMm);

  // Panorama.
  let panorama: ShotPlanPanorama | null = null;
  let grid: PanoramaGrid | null = null;
  const wantPanorama = i.panorama.mode === 'always' || (i.panorama.mode === 'auto' && fit.fitsIn.length === 0);
  if (wantPanorama) {
    let note: string | null = null;
    let cover: PanoramaCover = i.panorama.cover;
    let sky: SkyDirection[] = trackPoints;
    if (cover === 'galactic-plane') {
      const run = loopRunNear(plane, 0, i.panorama.skyTopAltDeg, peakPosition);
      if (run.length === 0) {
        note = `The galactic plane is not between the horizon and ${i.panorama.skyTopAltDeg} deg at the peak: the grid covers the target's path instead.`;
        cover = 'target-path';
      } else sky = [...run, peakPosition];
    }
    const span = skySpanOf([...landmarkPoints, ...sky]);
    const frameFov = heldFieldOfView(fit.fov, i.panorama.orientation);
    grid = field('panorama', () => panoramaGrid(
      { fromAzDeg: span.fromAzDeg, toAzDeg: span.toAzDeg, bottomAltDeg: span.bottomAltDeg, topAltDeg: span.topAltDeg },
      frameFov,
      i.panorama.overlap ?? DEFAULT_PANORAMA_OVERLAP,
    ));
    panorama = {
      reason: fit.fitsIn.length === 0 ? 'does-not-fit' : 'asked',
      orientation: i.panorama.orientation,
      cover,
      frameFov,
      span,
      rowCount: grid.rowCount,
      maxColumns: grid.maxColumns,
      frameCount: grid.frameCount,
      overlap: grid.overlap,
      rows: grid.rows,
      frames: grid.frames,
      field: grid.field,
      frameExposureS: i.panorama.frameExposureS ?? untrackedFrameS,
      frameGapS: i.panorama.frameGapS,
      note,
    };
  }

  // Blocks and the night.
  const subExposureS = i.sky.subExposureS ?? (i.tracked ? trackedSubRange.minS : untrackedFrameS);
  const totalIntegrationS = Math.max(i.sky.totalIntegrationS ?? (i.tracked ? DEFAULT_TRACKED_INTEGRATION_S : DEFAULT_UNTRACKED_INTEGRATION_S), subExposureS);
  const skyFrames = field('sky.totalIntegrationS', () => framesForIntegration(totalIntegrationS, subExposureS));
  const skyBlock = field('sky.totalIntegrationS', () => framesBlock('sky-stack', i.tracked ? 'Sky stack (tracked)' : 'Sky stack (untracked)', skyFrames, subExposureS, i.sky.frameGapS));
  const rows = grid;
  const rowBlocks = panorama && rows ? field('panorama', () => panoramaRowBlocks(rows, panorama.frameExposureS, panorama.frameGapS)) : [];
  const foregroundBlocks: ShootingBlock[] = i.foreground.frames > 0
    ? [field('foreground', () => framesBlock('foreground', `Foreground frames (${i.foreground.frames})`, i.foreground.frames, i.foreground.exposureS, i.sky.frameGapS))]
    : [];
  const blocks = i.foreground.first ? [...foregroundBlocks, skyBlock, ...rowBlocks] : [skyBlock, ...rowBlocks, ...foregroundBlocks];

  const night = nightDateOf(peak, tz);
  const report = nightReport(site, night, { timeZone: tz });
  const events = nightEventsFromReport(report, { start, peak, end }, i.tide?.cutOffAt ?? null);
  const shootingStart = i.startAt ?? start;
  const timeline = field('startAt', () => planNight(events, blocks, shootingStart, { gapS: i.blockGapS }));
  const placedSky = timeline.blocks.find((b) => b.kind === 'sky-stack');
  const stack = trackedStackPlan({
    subExposureS,
    totalIntegrationS,
    frameGapS: i.sky.frameGapS,
    start: placedSky ? placedSky.start : shootingStart,
    lineupEnd: end,
    moonrise: events.moonrise ?? null,
  });

  const cautions = shotPlanCautions({
    hasTideRule: i.sightline.hasTideRule,
    tideStatus: i.tide?.status ?? null,
    tideCutOffText: i.tide?.cutOffAt ? formatLocalTime(i.tide.cutOffAt, tz) : null,
    warnings: timeline.warnings.map((w) => w.message),
    compassReliable: geometry.compassReliable,
    declinationWarnings: geometry.declinationWarnings,
    trackedWithoutTracker: i.tracked && !i.starTrackerAvailable,
    noAstronomicalDarkness: report.state === 'no-astronomical-darkness' || report.state === 'midnight-sun',
  });

  const iso = (d: Date) => d.toISOString();
  return {
    sightline: { id: i.sightline.id, name: i.sightline.name },
    timezone: tz,
    night,
    site,
    landmark: { lat: i.sightline.landmark.lat, lon: i.sightline.landmark.lon },
    bearing: {
      distanceM: geometry.distanceM,
      trueDeg: geometry.trueBearingDeg,
      magneticDeg: geometry.magneticBearingDeg,
      declinationDeg: geometry.declinationDeg,
      compassReliable: geometry.compassReliable,
      warnings: geometry.declinationWarnings,
    },
    landmarkView: {
      azimuthDeg: az,
      topAltDeg: geometry.topElevationDeg,
      baseAltDeg: geometry.baseElevationDeg,
      angularWidthDeg: geometry.angularWidthDeg,
      points: landmarkPoints,
    },
    target: { ...(i.target.id ? { id: i.target.id } : {}), name: i.target.name, raHours: i.target.raHours, decDeg: i.target.decDeg },
    lineup: { start: iso(start), peak: iso(peak), end: iso(end), durationMin },
    track: track.map((t) => ({ azimuthDeg: t.azimuthDeg, altitudeDeg: t.altitudeDeg, at: new Date(t.timeMs).toISOString() })),
    galacticPlane: plane.filter((p) => p.altitudeDeg >= PLANE_SKETCH_MIN_ALT_DEG).map((p) => ({ azimuthDeg: p.azimuthDeg, altitudeDeg: p.altitudeDeg })),
    gear: {
      body: { id: i.body.id, name: i.body.name, sensorWidthMm: sensor.widthMm, sensorHeightMm: sensor.heightMm, cropFactor: derived.cropFactor, pixelPitchUm: derived.pixelPitchUm },
      lens: { id: i.lens.id, name: i.lens.name, minMm: range.minMm, maxMm: range.maxMm, isZoom: range.isZoom, widestApertureF: i.lens.widestApertureF },
      focalLengthMm,
      fNumber,
      tracked: i.tracked,
      starTrackerAvailable: i.starTrackerAvailable,
    },
    framing: {
      fov: fit.fov,
      landscape: fit.landscape,
      portrait: fit.portrait,
      fitsIn: fit.fitsIn,
      longestFitting: { focalLengthMm: lensFit.focalLengthMm, orientation: lensFit.orientation, centre: lensFit.centre },
    },
    panorama,
    exposure: {
      untracked,
      trackedSubRange,
      sky: {
        tracked: i.tracked,
        subExposureS,
        totalIntegrationS,
        frameGapS: i.sky.frameGapS,
        frames: stack.frames,
        durationS: stack.durationS,
        available: { seconds: stack.available.seconds, limitedBy: stack.available.limitedBy, until: iso(stack.available.until) },
        fits: stack.fits,
        framesInTime: stack.framesInTime,
        integrationInTimeS: stack.integrationInTimeS,
      },
      foreground: { frames: i.foreground.frames, exposureS: i.foreground.exposureS },
    },
    moon: { illuminatedFraction: report.moonAtMidnight.illuminatedFraction, phaseName: report.moonAtMidnight.phaseName },
    tide: i.tide ? { status: i.tide.status, cutOffAt: i.tide.cutOffAt ? iso(i.tide.cutOffAt) : null } : null,
    timeline: {
      start: iso(shootingStart),
      events: timeline.events.map((e) => ({ kind: e.kind, label: e.label, at: iso(e.at) })),
      blocks: timeline.blocks.map((b) => ({ index: b.index, kind: b.kind, label: b.label, durationS: b.durationS, start: iso(b.start), end: iso(b.end) })),
      warnings: timeline.warnings.map((w) => ({ ...w, deadlineAt: iso(w.deadlineAt) })),
      endsAt: iso(timeline.endsAt),
    },
    fieldNotes: (i.fieldNotes ?? []).map((n) => ({ kind: n.kind, body: n.body })),
    cautions,
    generatedAt: iso(now),
  };
}
