import { computed, ref, watch, type Ref } from 'vue';
import type { Photo } from '../../shared/schemas/photo';
import type { Lineup, LineupSearchResponse } from '../../shared/schemas/lineup';
import type { ObserverSite } from '../../shared/schemas/geometry';
import {
  frameOutline,
  galacticPlaneHorizontal,
  projectPolyline,
  projectTicks,
  runsAboveAltitude,
  skyToPixel,
  svgPathData,
  targetTrack,
  type CameraPose,
  type PixelPoint,
  type SkyDirection,
} from '../../shared/projection';
import { targetHorizontal } from '../../shared/sky';
import { MS_PER_HOUR, MS_PER_MINUTE } from '../../shared/units';
import { clockOf } from './useLineupTime';

/** How long before a lineup starts and after it ends the track and the slider reach, ms. */
const TRACK_PAD_MS = 2 * MS_PER_HOUR;
/** Spacing of the drawn track, minutes. */
const TRACK_STEP_MIN = 5;
/** Spacing of the labelled time ticks, minutes. */
const TICK_STEP_MIN = 30;
/** Slider step, ms. */
export const OVERLAY_SLIDER_STEP_MS = 5 * MS_PER_MINUTE;

/** Which layers to draw. */
export interface OverlayLayers {
  track: boolean;
  frame: boolean;
  galacticPlane: boolean;
  horizon: boolean;
}

/** A marker drawn in the photo, in the original's pixels. */
export interface OverlayMarker extends PixelPoint {
  label: string;
}

/** Points on the true horizon (altitude 0) every degree of azimuth. */
const HORIZON_POINTS: SkyDirection[] = Array.from({ length: 360 }, (_, i) => ({ azimuthDeg: i, altitudeDeg: 0 }));

/** Below this altitude the galactic plane is under the ground or sea and is not drawn, deg. */
const PLANE_MIN_ALTITUDE_DEG = -0.5;

function inImage(pose: CameraPose, p: { x: number; y: number; inFront: boolean }): boolean {
  return p.inFront && p.x >= 0 && p.x <= pose.widthPx && p.y >= 0 && p.y <= pose.heightPx;
}

function marker(pose: CameraPose, direction: SkyDirection, label: string): OverlayMarker | null {
  const p = skyToPixel(pose, direction);
  return inImage(pose, p) ? { x: p.x, y: p.y, label } : null;
}

/**
 * The sky overlay of a calibrated photo: for the chosen lineup, the target's track with time
 * ticks, its place at the peak and at the slider's time, the frame box, the galactic plane with
 * the galactic-centre marker, and the true horizon; all as SVG path data in the original's pixels.
 */
export function useSkyOverlay(
  photo: Ref<Photo | null>,
  site: Ref<ObserverSite | null>,
  result: Ref<LineupSearchResponse | null>,
) {
  const lineupIndex = ref(0);
  const timeMs = ref(Date.now());
  const layers = ref<OverlayLayers>({ track: true, frame: true, galacticPlane: true, horizon: true });

  const pose = computed<CameraPose | null>(() => photo.value?.calibration?.pose ?? null);
  const timeZone = computed(() => result.value?.timezone ?? 'UTC');
  const lineups = computed<Lineup[]>(() => result.value?.lineups ?? []);
  const lineup = computed<Lineup | null>(() => lineups.value[lineupIndex.value] ?? null);
  const target = computed(() => result.value?.target ?? null);

  /** The slider's span: the lineup with two hours either side, or the next twelve hours. */
  const span = computed(() => {
    const l = lineup.value;
    if (!l) {
      const start = Math.floor(Date.now() / OVERLAY_SLIDER_STEP_MS) * OVERLAY_SLIDER_STEP_MS;
      return { startMs: start, endMs: start + 12 * MS_PER_HOUR };
    }
    return { startMs: Date.parse(l.start) - TRACK_PAD_MS, endMs: Date.parse(l.end) + TRACK_PAD_MS };
  });

  // A new lineup puts the slider on its peak.
  watch(lineup, (l) => {
    timeMs.value = l ? Date.parse(l.peak) : span.value.startMs;
  }, { immediate: true });

  const lineupOptions = computed(() => lineups.value.map((l, i) => ({
    value: i,
    label: `${new Date(l.start).toLocaleDateString('en-GB', { timeZone: timeZone.value, weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' })} · ${clockOf(l.start, timeZone.value)}–${clockOf(l.end, timeZone.value)} · score ${Math.round(l.score * 100)}`,
  })));

  const samples = computed(() => {
    const t = target.value;
    const s = site.value;
    if (!t || !s || !lineup.value) return null;
    const { startMs, endMs } = span.value;
    return targetTrack(t, s, new Date(startMs), new Date(endMs), TRACK_STEP_MIN);
  });

  const trackPath = computed(() => {
    const p = pose.value;
    return p && samples.value ? svgPathData(projectPolyline(p, samples.value)) : '';
  });

  /** Labelled ticks on round half-hours. */
  const ticks = computed(() => {
    const p = pose.value;
    const t = target.value;
    const s = site.value;
    if (!p || !t || !s || !lineup.value) return [];
    const step = TICK_STEP_MIN * MS_PER_MINUTE;
    const first = Math.ceil(span.value.startMs / step) * step;
    const timed = [];
    for (let ms = first; ms <= span.value.endMs; ms += step) {
      const h = targetHorizontal(t, s, new Date(ms));
      timed.push({ timeMs: ms, azimuthDeg: h.azimuthDeg, altitudeDeg: h.altitudeDeg });
    }
    return projectTicks(p, timed).map((tick) => ({ ...tick, label: clockOf(new Date(tick.timeMs), timeZone.value) }));
  });

  const peakMarker = computed(() => {
    const p = pose.value;
    const l = lineup.value;
    return p && l ? marker(p, { azimuthDeg: l.peakAzimuthDeg, altitudeDeg: l.peakAltitudeDeg }, `Peak ${clockOf(l.peak, timeZone.value)}`) : null;
  });

  const now = computed(() => {
    const t = target.value;
    const s = site.value;
    if (!t || !s) return null;
    const h = targetHorizontal(t, s, new Date(timeMs.value));
    return { azimuthDeg: h.azimuthDeg, altitudeDeg: h.altitudeDeg };
  });

  const targetMarker = computed(() => {
    const p = pose.value;
    const d = now.value;
    return p && d && target.value ? marker(p, d, target.value.name) : null;
  });

  const framePath = computed(() => {
    const p = pose.value;
    const f = result.value?.frame;
    return p && f ? svgPathData(frameOutline(p, f)) : '';
  });

  const galactic = computed(() => {
    const p = pose.value;
    const s = site.value;
    if (!p || !s) return { path: '', centre: null as OverlayMarker | null };
    const plane = galacticPlaneHorizontal(s, new Date(timeMs.value), 1);
    const gc = plane[0]!;
    const { runs, closed } = runsAboveAltitude(plane, PLANE_MIN_ALTITUDE_DEG);
    return {
      path: svgPathData(runs.flatMap((run) => projectPolyline(p, run, { closed }))),
      centre: gc.altitudeDeg >= PLANE_MIN_ALTITUDE_DEG ? marker(p, gc, 'Galactic centre') : null,
    };
  });

  const horizonPath = computed(() => {
    const p = pose.value;
    return p ? svgPathData(projectPolyline(p, HORIZON_POINTS, { closed: true })) : '';
  });

  /** Where the landmark top falls with the saved pose (on the click when calibrated well). */
  const landmarkMarker = computed(() => {
    const p = pose.value;
    const c = photo.value?.calibration;
    return p && c ? marker(p, c.landmark, 'Landmark top') : null;
  });

  const timeLabel = computed(() => clockOf(new Date(timeMs.value), timeZone.value));

  return {
    pose, lineups, lineup, lineupIndex, lineupOptions, target, span, timeMs, timeLabel, layers, now,
    trackPath, ticks, peakMarker, targetMarker, framePath, galactic, horizonPath, landmarkMarker,
  };
}
export type SkyOverlay = ReturnType<typeof useSkyOverlay>;
