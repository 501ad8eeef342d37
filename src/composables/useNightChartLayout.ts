import { computed, type Ref } from 'vue';
import { linearScale, piecewiseLinearScale, seriesPath, type NightChartSeries, type SkyBrightness } from '../../shared/chart';
import type { Frame } from '../../shared/schemas/geometry';
import type { Lineup } from '../../shared/schemas/lineup';
import type { SkyOutlook } from '../../shared/schemas/outlook';
import { cloudBars } from '../../shared/outlook';
import type { TideStretch } from './useNightChart';
import { clockOf, zoneOf } from './useLineupTime';

/** Altitudes shown on the time panel, degrees: down to -20 for the twilight band. */
export const TIME_PANEL_ALT_DOMAIN_DEG: [number, number] = [-20, 90];
const Y_TICKS_DEG = [-18, -12, -6, 0, 15, 30, 45, 60, 75, 90];
/** Share of the plot's height given to altitudes below the horizon. */
const TWILIGHT_SHARE = 0.26;

interface Rect { x: number; y: number; width: number; height: number }

/** Everything the time panel (altitude against local time) draws, in SVG user units (CSS px). */
export interface TimePanelLayout {
  width: number;
  height: number;
  plot: Rect;
  twilight: Array<Rect & { kind: SkyBrightness }>;
  frameBand: Rect;
  frameAzimuth: Rect[];
  inFrame: Rect[];
  landmarkY: number;
  horizonY: number;
  sunPath: string;
  moonPath: string;
  targetPath: string;
  targetHourDots: Array<{ x: number; y: number; label: string }>;
  xTicks: Array<{ x: number; label: string }>;
  yTicks: Array<{ y: number; label: string; limit: boolean }>;
  lineups: Array<Rect & { label: string; key: string; tide: Lineup['tideStatus'] }>;
  tide: Array<Rect & { status: TideStretch['status'] }> | null;
  /**
   * The sky outlook strip under the plot: per lineup with a forecast, a track over its window and
   * one bar per forecast hour, as tall as that hour's total cloud cover; null without forecasts.
   */
  cloud: { y: number; height: number; tracks: Rect[]; bars: Array<Rect & { cloudPct: number; title: string }> } | null;
}

/** Height of the cloud strip, px: 100 % cloud fills it. */
const CLOUD_STRIP_PX = 16;

/** The title of a cloud bar: the hour in the site zone and its cloud, layers where given. */
function barTitle(bar: ReturnType<typeof cloudBars>[number], timeZone: string): string {
  const layers = [['low', bar.lowPct], ['mid', bar.midPct], ['high', bar.highPct]]
    .filter((l): l is [string, number] => l[1] !== null)
    .map(([name, v]) => `${name} ${Math.round(v)} %`);
  const rain = bar.precipitationProbabilityPct === null ? '' : `, rain chance ${Math.round(bar.precipitationProbabilityPct)} %`;
  return `${clockOf(bar.time, timeZone)} ${zoneOf(bar.time, timeZone)}: cloud ${Math.round(bar.cloudPct)} %${layers.length ? ` (${layers.join(', ')})` : ''}${rain}`;
}

/**
 * Lays out the time panel of the night chart for a width in CSS pixels: scales from
 * shared/chart, then rectangles and path data for each layer.
 */
export function useNightChartLayout(
  series: Ref<NightChartSeries | null>,
  width: Ref<number>,
  frame: Ref<Frame | null>,
  nightLineups: Ref<readonly Lineup[]>,
  tide: Ref<TideStretch[] | null>,
  /** Sky outlooks by lineup start (optional): the cloud strip is drawn for those with a forecast. */
  outlooks?: Ref<ReadonlyMap<string, SkyOutlook>>,
) {
  return computed<TimePanelLayout | null>(() => {
    const s = series.value;
    const f = frame.value;
    if (!s || !f || s.timesMs.length < 2) return null;
    const w = width.value;
    const narrow = w < 560;
    const tideH = tide.value ? 12 : 0;
    const forecasts = nightLineups.value
      .map((l) => outlooks?.value.get(l.start))
      .filter((o): o is Extract<SkyOutlook, { status: 'forecast' }> => o?.status === 'forecast');
    const cloudH = forecasts.length ? CLOUD_STRIP_PX : 0;
    const pad = { left: 38, right: 10, top: 12, bottom: 26 + (tideH ? tideH + 8 : 0) + (cloudH ? cloudH + 8 : 0) };
    const height = narrow ? 300 : 360;
    const plot: Rect = { x: pad.left, y: pad.top, width: w - pad.left - pad.right, height: height - pad.top - pad.bottom };
    const x = linearScale([s.span.startMs, s.span.endMs], [plot.x, plot.x + plot.width]);
    // Below the horizon only the Sun's twilight matters: -20..0 deg gets a quarter of the height.
    const horizonPx = plot.y + plot.height * (1 - TWILIGHT_SHARE);
    const y = piecewiseLinearScale([TIME_PANEL_ALT_DOMAIN_DEG[0], 0, TIME_PANEL_ALT_DOMAIN_DEG[1]], [plot.y + plot.height, horizonPx, plot.y]);
    const xRect = (startMs: number, endMs: number, top: number, bottom: number): Rect => {
      const x0 = x.map(Math.max(startMs, s.span.startMs));
      const x1 = x.map(Math.min(endMs, s.span.endMs));
      return { x: x0, y: top, width: Math.max(x1 - x0, 1), height: bottom - top };
    };
    const bandTop = y.map(Math.min(f.topAltDeg, 90));
    const bandBottom = y.map(Math.max(f.bottomAltDeg, TIME_PANEL_ALT_DOMAIN_DEG[0]));
    const every = narrow ? 2 : 1;
    const targetAt = (ms: number): number => {
      const i = Math.round((ms - s.span.startMs) / s.stepMs);
      return s.targetAltDeg[Math.min(Math.max(i, 0), s.targetAltDeg.length - 1)]!;
    };
    const visibleAlt = (alt: number) => alt >= TIME_PANEL_ALT_DOMAIN_DEG[0] - 5;
    const tideTop = plot.y + plot.height + 22;
    const cloudTop = tideH ? tideTop + tideH + 8 : tideTop;
    let cloud: TimePanelLayout['cloud'] = null;
    if (cloudH) {
      // A forecast that cannot be drawn leaves the strip out, never the chart.
      try {
        const tracks = forecasts.map((o) => xRect(Date.parse(o.start), Date.parse(o.end), cloudTop, cloudTop + cloudH));
        const bars = forecasts.flatMap((o) => cloudBars(o)).map((b) => {
          const r = xRect(b.startMs, b.endMs, cloudTop, cloudTop + cloudH);
          const barH = Math.max((cloudH * Math.min(Math.max(b.cloudPct, 0), 100)) / 100, 0);
          return { x: r.x, width: r.width, y: cloudTop + cloudH - barH, height: barH, cloudPct: b.cloudPct, title: barTitle(b, s.timeZone) };
        });
        cloud = { y: cloudTop, height: cloudH, tracks, bars };
      } catch {
        cloud = null;
      }
    }

    return {
      width: w,
      height,
      plot,
      twilight: s.twilight.map((t) => ({ ...xRect(t.startMs, t.endMs, plot.y, plot.y + plot.height), kind: t.kind })),
      frameBand: { x: plot.x, y: bandTop, width: plot.width, height: bandBottom - bandTop },
      frameAzimuth: s.frameAzimuthRuns.map((r) => xRect(r.startMs, r.endMs, bandTop, bandBottom)),
      inFrame: s.frameRuns.map((r) => xRect(r.startMs, r.endMs, bandTop, bandBottom)),
      landmarkY: y.map(f.bottomAltDeg),
      horizonY: y.map(0),
      sunPath: seriesPath(s.timesMs, s.sunAltDeg, x, y, (i) => visibleAlt(s.sunAltDeg[i]!)),
      moonPath: seriesPath(s.timesMs, s.moonAltDeg, x, y, (i) => visibleAlt(s.moonAltDeg[i]!)),
      targetPath: seriesPath(s.timesMs, s.targetAltDeg, x, y, (i) => visibleAlt(s.targetAltDeg[i]!)),
      targetHourDots: s.hourTicks
        .filter((t) => targetAt(t.atMs) >= TIME_PANEL_ALT_DOMAIN_DEG[0])
        .map((t) => ({ x: x.map(t.atMs), y: y.map(targetAt(t.atMs)), label: t.label })),
      xTicks: s.hourTicks.filter((t) => t.hour % every === 0).map((t) => ({ x: x.map(t.atMs), label: t.label.slice(0, 2) })),
      yTicks: Y_TICKS_DEG.map((deg) => ({ y: y.map(deg), label: `${deg}°`, limit: deg < 0 })),
      lineups: nightLineups.value.map((l) => ({
        ...xRect(Date.parse(l.start), Date.parse(l.end), plot.y, plot.y + plot.height),
        key: l.start,
        label: `${clockOf(l.start, s.timeZone)}–${clockOf(l.end, s.timeZone)}`,
        tide: l.tideStatus,
      })),
      tide: tide.value ? tide.value.map((t) => ({ ...xRect(t.startMs, t.endMs, tideTop, tideTop + tideH), status: t.status })) : null,
      cloud,
    };
  });
}
