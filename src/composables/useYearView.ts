import { computed, onMounted, ref, watch, type Ref } from 'vue';
import { DateTime } from 'luxon';
import { yearHeatmap, yearViewRange, type YearMonth, type YearNight } from '../../shared/chart';
import { computeDarkWindows } from '../../shared/lineup';
import type { LineupSearchRequestBody } from '../../shared/schemas/lineup';
import { useSightlinePageContext } from './useSightlineDetailPage';
import { nightLabel } from './useLineupTime';

/** Months in the year view. */
export const YEAR_VIEW_MONTHS = 12;
/** Width of the month labels, px. */
const LABEL_W = 62;
const HEADER_H = 18;
const GAP = 2;
/** Below this width (px) the months become columns. */
const NARROW_BELOW_PX = 520;

/** A drawn night cell. */
export interface YearCell extends YearNight {
  x: number;
  y: number;
  width: number;
  height: number;
  /** 'score': a lineup (fill by score); 'empty': dark but no lineup; 'no-dark': no astronomical darkness. */
  kind: 'score' | 'empty' | 'no-dark';
  title: string;
}

function shiftMonth(month: string, by: number): string {
  return DateTime.fromISO(`${month}-01`, { zone: 'UTC' }).plus({ months: by }).toFormat('yyyy-MM');
}

/**
 * The year view: one search over twelve months (from a start month) with the target and
 * conditions of the last search, the nights without astronomical darkness (computeDarkWindows with
 * the Moon ignored), and the heat-map cells laid out for a width.
 */
export function useYearView(width: Ref<number>) {
  const page = useSightlinePageContext();
  const { detail, lineups } = page;
  const year = lineups.year;
  const timeZone = computed(() => detail.timeZone);

  const initialMonth = (): string => {
    const from = lineups.search.body?.from;
    if (typeof from === 'string') return DateTime.fromISO(from, { zone: timeZone.value }).toFormat('yyyy-MM');
    return DateTime.now().setZone(timeZone.value).toFormat('yyyy-MM');
  };
  const startMonth = ref(initialMonth());

  const range = computed(() => yearViewRange(startMonth.value, YEAR_VIEW_MONTHS, timeZone.value));

  /** The year search wanted now: the last search's target and conditions over the year. */
  const wanted = computed<LineupSearchRequestBody | null>(() => {
    const base = lineups.search.body;
    if (!base) return null;
    return { ...base, from: range.value.from.toISOString(), to: range.value.to.toISOString() };
  });
  const wantedKey = computed(() => JSON.stringify(wanted.value));
  const upToDate = computed(() => year.body !== null && JSON.stringify(year.body) === wantedKey.value);

  /** The year view stays mounted once shown: it searches only while its tab is open. */
  const active = computed(() => page.tab.value === 'year');
  function refresh(): void {
    if (active.value && wanted.value && !upToDate.value) void lineups.runYear(wanted.value);
  }
  onMounted(refresh);
  watch([wantedKey, active], refresh);

  const darkness = computed(() => {
    const site = detail.site;
    if (!site) return undefined;
    try {
      // The Moon ignored (any illumination): plain astronomical darkness, Sun below -18 deg.
      return computeDarkWindows(site, range.value.from, range.value.to, { sunMaxAltDeg: -18, moon: { maxIllumination: 1 } }).windows;
    } catch {
      return undefined;
    }
  });

  const months = computed<YearMonth[]>(() => yearHeatmap({
    startMonth: startMonth.value,
    months: YEAR_VIEW_MONTHS,
    timeZone: timeZone.value,
    lineups: upToDate.value ? year.result?.lineups ?? [] : [],
    darkness: darkness.value,
  }));

  /**
   * Wide screens: one row a month, one column a day of the month. Narrow screens (phones): one
   * column a month, one row a day, so cells stay big enough to read and tap.
   */
  const layout = computed(() => {
    const narrow = width.value < NARROW_BELOW_PX;
    const cells: YearCell[] = [];
    let cellW: number;
    let cellH: number;
    let place: (row: number, day: number) => { x: number; y: number };
    let rows: Array<{ key: string; label: string; sub: string; x: number; y: number; anchor: 'start' | 'middle' }>;
    let dayTicks: Array<{ day: number; x: number; y: number; anchor: 'start' | 'middle' | 'end' }>;
    let w: number;
    let h: number;
    const monthLabel = (m: YearMonth, short: boolean) => DateTime.fromObject({ year: m.year, month: m.month, day: 1 }, { zone: 'UTC' }).toFormat(short ? 'LLL' : 'LLL yyyy');
    if (!narrow) {
      cellW = Math.max(7, Math.min(24, Math.floor((width.value - LABEL_W) / 31) - GAP));
      cellH = cellW;
      place = (row, day) => ({ x: LABEL_W + (day - 1) * (cellW + GAP), y: HEADER_H + row * (cellH + GAP) });
      rows = months.value.map((m, row) => ({ key: m.key, label: monthLabel(m, false), sub: '', x: 0, y: HEADER_H + row * (cellH + GAP) + cellH / 2 + 4, anchor: 'start' }));
      dayTicks = [1, 5, 10, 15, 20, 25, 31].map((d) => ({ day: d, x: LABEL_W + (d - 1) * (cellW + GAP) + cellW / 2, y: 11, anchor: 'middle' }));
      w = LABEL_W + 31 * (cellW + GAP);
      h = HEADER_H + YEAR_VIEW_MONTHS * (cellH + GAP);
    } else {
      const dayLabelW = 20;
      const headerH = 28;
      cellW = Math.max(10, Math.floor((width.value - dayLabelW) / YEAR_VIEW_MONTHS) - GAP);
      cellH = 11;
      place = (col, day) => ({ x: dayLabelW + col * (cellW + GAP), y: headerH + (day - 1) * (cellH + GAP) });
      rows = months.value.map((m, col) => ({
        key: m.key,
        label: monthLabel(m, true),
        sub: col === 0 || m.month === 1 ? `’${String(m.year).slice(2)}` : '',
        x: dayLabelW + col * (cellW + GAP) + cellW / 2,
        y: 11,
        anchor: 'middle',
      }));
      dayTicks = [1, 5, 10, 15, 20, 25, 31].map((d) => ({ day: d, x: dayLabelW - 4, y: headerH + (d - 1) * (cellH + GAP) + cellH - 2, anchor: 'end' }));
      w = dayLabelW + YEAR_VIEW_MONTHS * (cellW + GAP);
      h = headerH + 31 * (cellH + GAP);
    }
    months.value.forEach((m, index) => {
      for (const n of m.nights) {
        const kind: YearCell['kind'] = n.bestScore !== null ? 'score' : n.hasDarkness === false ? 'no-dark' : 'empty';
        const parts = [nightLabel(n.date)];
        if (n.bestScore !== null) parts.push(`best score ${Math.round(n.bestScore * 100)} %, ${n.lineupCount} lineup${n.lineupCount === 1 ? '' : 's'}`);
        else parts.push('no lineup');
        if (n.hasDarkness === false) parts.push('no astronomical darkness');
        cells.push({ ...n, ...place(index, n.day), width: cellW, height: cellH, kind, title: parts.join(': ') });
      }
    });
    return { narrow, cells, rows, dayTicks, width: w, height: h };
  });

  const summary = computed(() => {
    const nights = months.value.flatMap((m) => m.nights);
    return {
      lineupNights: nights.filter((n) => n.bestScore !== null).length,
      noDarkNights: nights.filter((n) => n.hasDarkness === false).length,
    };
  });

  return {
    startMonth,
    range,
    year,
    upToDate,
    months,
    layout,
    summary,
    hasSearch: computed(() => lineups.search.body !== null),
    targetName: computed(() => year.result?.target.name ?? lineups.search.result?.target.name ?? ''),
    previous: () => { startMonth.value = shiftMonth(startMonth.value, -12); },
    next: () => { startMonth.value = shiftMonth(startMonth.value, 12); },
    setStartMonth: (month: string) => { startMonth.value = month; },
    cancel: () => lineups.cancelYear(),
    retry: () => { if (wanted.value) void lineups.runYear(wanted.value); },
    openNight: (date: string) => page.openNight(date),
  };
}
