import { computed, type Ref } from 'vue';
import type { ShotPlan } from '../../shared/schemas/shot-plan';
import { angularSeparationDeg, type SkyDirection } from '../../shared/projection/camera';
import { frameOutlineDirections, unwrapAzimuthDeg, unwrapAzimuthSequence } from '../../shared/shotplan/outline';
import { azAltBox } from '../../shared/shotplan/sketch';
import { clockOf } from './useLineupTime';

/** A drawn frame: its outline path and where its label goes. */
export interface SketchFrame {
  key: string;
  label: string;
  path: string;
  x: number;
  y: number;
}

/** The azimuth/altitude sketch of a shot plan, in SVG user units (CSS pixels). */
export interface SkySketch {
  width: number;
  height: number;
  /** Inner plot area (after the axis margins). */
  plot: { x: number; y: number; width: number; height: number };
  horizonY: number | null;
  azTicks: Array<{ x: number; label: string }>;
  altTicks: Array<{ y: number; label: string }>;
  landmarkPath: string;
  trackPath: string;
  trackTicks: Array<{ x: number; y: number; label: string }>;
  planePath: string;
  /** The single frame at the aim (when everything fits), else null. */
  aim: SketchFrame | null;
  /** The panorama grid's frames. */
  frames: SketchFrame[];
}

const MARGIN = { left: 34, right: 8, top: 8, bottom: 22 };
/** Points an outline edge is traced with. */
const OUTLINE_SAMPLES = 6;
/** A jump in unwrapped azimuth larger than this breaks a drawn path (it went round the back), degrees. */
const BREAK_DEG = 60;
/** Neighbouring galactic-plane points (2 deg of longitude apart) farther apart than this are not joined, degrees. */
const PLANE_GAP_DEG = 6;

const COMPASS = ['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW'];

function azLabel(az: number): string {
  const a = ((Math.round(az) % 360) + 360) % 360;
  return a % 45 === 0 ? COMPASS[a / 45]! : `${a}°`;
}

function tickStep(spanDeg: number, target = 6): number {
  return [1, 2, 5, 10, 15, 30, 45, 90].find((s) => spanDeg / s <= target) ?? 90;
}

/**
 * The sketch's geometry for a plan and a width: the sky box around the landmark, the target's path
 * with time ticks on the half-hours, the galactic plane, the landmark, the horizon, the aim's
 * frame and the panorama grid's frames, all on an azimuth (unwrapped around the landmark) /
 * altitude plot with equal degrees both ways where the height allows.
 */
export function skySketch(plan: ShotPlan, width: number): SkySketch {
  const centre = plan.landmarkView.azimuthDeg;
  const timeZone = plan.timezone;
  const fov = plan.framing.fov;
  const aimFit = plan.framing.fitsIn[0] ? plan.framing[plan.framing.fitsIn[0]] : null;
  const aimFov = aimFit?.orientation === 'portrait' ? { horizontalDeg: fov.verticalDeg, verticalDeg: fov.horizontalDeg } : { horizontalDeg: fov.horizontalDeg, verticalDeg: fov.verticalDeg };
  const aimOutline = aimFit?.centre && aimFov.horizontalDeg < 179 ? frameOutlineDirections(aimFit.centre, aimFov, OUTLINE_SAMPLES) : null;
  const gridOutlines = plan.panorama ? plan.panorama.frames.map((f) => ({ f, outline: frameOutlineDirections(f, plan.panorama!.frameFov, OUTLINE_SAMPLES) })) : [];

  const all: SkyDirection[] = [...plan.landmarkView.points, ...plan.track, ...(aimOutline ?? []), ...gridOutlines.flatMap((g) => g.outline)];
  const box = azAltBox(all, centre, 4, 20);
  const bottom = Math.min(box.bottomAltDeg, -3);
  const azSpan = box.toAzDeg - box.fromAzDeg;
  const altSpan = box.topAltDeg - bottom;
  const plotWidth = Math.max(120, width - MARGIN.left - MARGIN.right);
  const plotHeight = Math.min(420, Math.max(160, (plotWidth * altSpan) / azSpan));
  const height = plotHeight + MARGIN.top + MARGIN.bottom;
  const x = (az: number) => MARGIN.left + ((az - box.fromAzDeg) / azSpan) * plotWidth;
  const y = (alt: number) => MARGIN.top + ((box.topAltDeg - alt) / altSpan) * plotHeight;
  const f1 = (n: number) => n.toFixed(1);

  /** A path through directions, unwrapped around the centre, broken where it jumps round the back or (with `gapDeg`) across a gap. */
  function path(points: readonly SkyDirection[], closed = false, gapDeg = Infinity): string {
    if (points.length === 0) return '';
    const azs = unwrapAzimuthSequence(points.map((p) => p.azimuthDeg), centre);
    let d = '';
    azs.forEach((a, i) => {
      const jump = i > 0 && (Math.abs(a - azs[i - 1]!) > BREAK_DEG || (gapDeg < Infinity && angularSeparationDeg(points[i - 1]!, points[i]!) > gapDeg));
      d += `${i === 0 || jump ? 'M' : 'L'}${f1(x(a))} ${f1(y(points[i]!.altitudeDeg))}`;
    });
    return closed ? `${d}Z` : d;
  }

  function frame(key: string, label: string, outline: SkyDirection[], at: SkyDirection): SketchFrame {
    return { key, label, path: path(outline, true), x: x(unwrapAzimuthDeg(at.azimuthDeg, centre)), y: y(at.altitudeDeg) };
  }

  const lv = plan.landmarkView;
  const landmarkPath = lv.points.length >= 6
    ? path([lv.points[2]!, lv.points[4]!, lv.points[5]!, lv.points[3]!], true)
    : path([lv.points[0]!, lv.points[1]!]);

  // Ticks at the lineup's start and end and on the half-hours between, placed between samples.
  const trackAz = unwrapAzimuthSequence(plan.track.map((t) => t.azimuthDeg), centre);
  const trackMs = plan.track.map((t) => Date.parse(t.at));
  const tickAt = (ms: number) => {
    const i = Math.max(1, trackMs.findIndex((t) => t >= ms));
    const t0 = trackMs[i - 1]!;
    const t1 = trackMs[i] ?? t0;
    const k = t1 > t0 ? (ms - t0) / (t1 - t0) : 0;
    const az = trackAz[i - 1]! + k * ((trackAz[i] ?? trackAz[i - 1]!) - trackAz[i - 1]!);
    const alt = plan.track[i - 1]!.altitudeDeg + k * ((plan.track[i] ?? plan.track[i - 1]!).altitudeDeg - plan.track[i - 1]!.altitudeDeg);
    return { x: x(az), y: y(alt), label: clockOf(new Date(ms), timeZone) };
  };
  const trackTicks: SkySketch['trackTicks'] = [];
  if (trackMs.length > 1) {
    const startMs = trackMs[0]!;
    const endMs = trackMs.at(-1)!;
    const halfHour = 30 * 60_000;
    trackTicks.push(tickAt(startMs));
    for (let ms = Math.ceil(startMs / halfHour) * halfHour; ms < endMs; ms += halfHour) if (ms - startMs > halfHour / 3 && endMs - ms > halfHour / 3) trackTicks.push(tickAt(ms));
    trackTicks.push(tickAt(endMs));
  }
  // Labels closer than this to the last one kept are left out (the dots stay).
  let lastX = -Infinity;
  let lastY = -Infinity;
  for (const t of trackTicks) {
    if (Math.hypot(t.x - lastX, t.y - lastY) < 38) t.label = '';
    else { lastX = t.x; lastY = t.y; }
  }

  const azStep = tickStep(azSpan);
  const azTicks: SkySketch['azTicks'] = [];
  for (let a = Math.ceil(box.fromAzDeg / azStep) * azStep; a <= box.toAzDeg; a += azStep) azTicks.push({ x: x(a), label: azLabel(a) });
  const altStep = tickStep(altSpan, 5);
  const altTicks: SkySketch['altTicks'] = [];
  for (let a = Math.ceil(bottom / altStep) * altStep; a <= box.topAltDeg; a += altStep) altTicks.push({ y: y(a), label: `${a}°` });

  // The plane's points come in galactic-longitude order round a loop; only the stretch inside the
  // box is drawn, started after a gap so that the loop's seam (l = 360 to 0) does not cut it.
  const inBox = plan.galacticPlane.filter((p) => {
    const a = unwrapAzimuthDeg(p.azimuthDeg, centre);
    return a >= box.fromAzDeg - 10 && a <= box.toAzDeg + 10;
  });
  const apart = (a: SkyDirection, b: SkyDirection) => angularSeparationDeg(a, b) > PLANE_GAP_DEG;
  const gapAt = inBox.findIndex((p, i) => i > 0 && apart(inBox[i - 1]!, p));
  const plane = gapAt > 0 && inBox.length > 1 && !apart(inBox.at(-1)!, inBox[0]!)
    ? [...inBox.slice(gapAt), ...inBox.slice(0, gapAt)]
    : inBox;

  return {
    width,
    height,
    plot: { x: MARGIN.left, y: MARGIN.top, width: plotWidth, height: plotHeight },
    horizonY: 0 >= bottom && 0 <= box.topAltDeg ? y(0) : null,
    azTicks,
    altTicks,
    landmarkPath,
    trackPath: path(plan.track),
    trackTicks,
    planePath: path(plane, false, PLANE_GAP_DEG),
    aim: aimOutline && aimFit?.centre ? frame('aim', aimFit.orientation, aimOutline, aimFit.centre) : null,
    frames: gridOutlines.map(({ f, outline }) => frame(`${f.row}-${f.column}`, `${f.row + 1}.${f.column + 1}`, outline, f)),
  };
}

/** The sketch of the store's plan at the measured width. */
export function useShotPlanSketch(plan: Ref<ShotPlan | null>, width: Ref<number>) {
  return computed<SkySketch | null>(() => (plan.value ? skySketch(plan.value, width.value) : null));
}
