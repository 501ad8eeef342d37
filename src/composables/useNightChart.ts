import { computed } from 'vue';
import { DateTime } from 'luxon';
import { nightChartSeries, nightDateOf, type MsInterval, type NightChartSeries } from '../../shared/chart';
import type { Lineup } from '../../shared/schemas/lineup';
import type { EquatorialJ2000 } from '../../shared/schemas/geometry';
import { findTarget } from '../../shared/sky';
import { tideAccess, type TideStatus } from '../../shared/tide';
import { useSightlinePageContext } from './useSightlineDetailPage';
import { clockOf, nightOf } from './useLineupTime';

/** A stretch of the night with one tide state (from the tide rule and the stored tide times). */
export interface TideStretch extends MsInterval {
  status: TideStatus;
}

/** The target a night chart draws: the last search's, else the form's catalogue choice. */
export interface ChartTarget extends EquatorialJ2000 {
  name: string;
}

/** Clips intervals to a span. */
function clip(list: ReadonlyArray<{ start: Date; end: Date }>, span: MsInterval): MsInterval[] {
  return list
    .map((iv) => ({ startMs: Math.max(iv.start.getTime(), span.startMs), endMs: Math.min(iv.end.getTime(), span.endMs) }))
    .filter((iv) => iv.endMs > iv.startMs);
}

/** The tide stretches of a span: reachable, cut off, and unknown for the rest. */
export function tideStretches(access: ReturnType<typeof tideAccess>, span: MsInterval): TideStretch[] {
  const known: TideStretch[] = [
    ...clip(access.reachable, span).map((iv) => ({ ...iv, status: 'reachable' as const })),
    ...clip(access.cutOff, span).map((iv) => ({ ...iv, status: 'cut-off' as const })),
  ].sort((a, b) => a.startMs - b.startMs);
  const out: TideStretch[] = [];
  let at = span.startMs;
  for (const k of known) {
    if (k.startMs > at) out.push({ startMs: at, endMs: k.startMs, status: 'unknown' });
    out.push(k);
    at = Math.max(at, k.endMs);
  }
  if (at < span.endMs) out.push({ startMs: at, endMs: span.endMs, status: 'unknown' });
  return out;
}

/**
 * The night chart's data for the chosen night: the sampled series (shared/chart), the lineups of
 * that night from the last search, the tide stretches, and the night's key moments.
 */
export function useNightChart() {
  const page = useSightlinePageContext();
  const { detail, lineups } = page;

  const target = computed<ChartTarget | null>(() => {
    const t = lineups.search.result?.target;
    if (t) return { name: t.name, raHours: t.raHours, decDeg: t.decDeg };
    const c = findTarget(page.form.form.targetId) ?? findTarget(detail.sightline?.targetId ?? '');
    return c ? { name: c.name, raHours: c.raHours, decDeg: c.decDeg } : null;
  });
  const frame = computed(() => lineups.search.result?.frame ?? detail.frame);
  const timeZone = computed(() => detail.timeZone);

  const allLineups = computed<Lineup[]>(() => lineups.search.result?.lineups ?? []);

  /** The night shown: the chosen one, else the first lineup's, else tonight (site zone). */
  const night = computed(() => {
    if (lineups.selectedNight) return lineups.selectedNight;
    const first = allLineups.value[0];
    if (first) return nightOf(first.start, timeZone.value);
    return nightDateOf(new Date(), timeZone.value);
  });

  const computedSeries = computed<{ series: NightChartSeries | null; error: string }>(() => {
    const site = detail.site;
    const f = frame.value;
    const t = target.value;
    if (!site || !f || !t) return { series: null, error: '' };
    try {
      return { series: nightChartSeries({ site, timeZone: timeZone.value, date: night.value, target: t, frame: f }), error: '' };
    } catch (error) {
      return { series: null, error: (error as Error).message };
    }
  });
  const series = computed(() => computedSeries.value.series);
  const error = computed(() => computedSeries.value.error);

  const nightLineups = computed(() => allLineups.value.filter((l) => nightOf(l.start, timeZone.value) === night.value));

  const tide = computed<TideStretch[] | null>(() => {
    const rule = detail.sightline?.tideRule;
    const s = series.value;
    if (!rule || !s) return null;
    try {
      return tideStretches(tideAccess(rule, detail.tideEvents), s.span);
    } catch {
      return null;
    }
  });

  /** Sunset, darkness and sunrise of the night as local clock times. */
  const moments = computed(() => {
    const s = series.value;
    if (!s) return [];
    const tz = timeZone.value;
    const find = (limit: number, direction: 'setting' | 'rising') => {
      const list = s.sunCrossings.filter((c) => Math.abs(c.limitDeg - limit) < 1e-6 && c.direction === direction);
      const c = direction === 'setting' ? list[list.length - 1] : list[0];
      return c ? clockOf(new Date(c.atMs), tz) : null;
    };
    const list = [
      { key: 'sunset', label: 'Sunset', clock: find(-50 / 60, 'setting') },
      { key: 'dark-start', label: 'Dark from', clock: find(-18, 'setting') },
      { key: 'dark-end', label: 'Dark until', clock: find(-18, 'rising') },
      { key: 'sunrise', label: 'Sunrise', clock: find(-50 / 60, 'rising') },
    ];
    const out = list.filter((m): m is { key: string; label: string; clock: string } => m.clock !== null);
    out.push({ key: 'moon', label: 'Moon', clock: `${Math.round(s.moonIllumination * 100)} % lit at midnight` });
    return out;
  });

  const hasDarkness = computed(() => series.value?.twilight.some((t) => t.kind === 'dark') ?? true);

  function setNight(date: string): void {
    page.openNight(date);
  }

  function shiftNight(days: number): void {
    const next = DateTime.fromISO(night.value, { zone: 'UTC' }).plus({ days }).toISODate();
    if (next) page.openNight(next);
  }

  return { target, frame, timeZone, night, series, error, nightLineups, tide, moments, hasDarkness, setNight, shiftNight, geometry: computed(() => detail.geometry) };
}
