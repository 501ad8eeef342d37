import { computed, type Ref } from 'vue';
import { localHourTicks } from '../../shared/chart/localTime';
import type { ShotPlan } from '../../shared/schemas/shot-plan';
import { timelineBarLayout, type TimelineBarLayout } from '../../shared/shotplan/sketch';
import { clockOf, zoneOf } from './useLineupTime';

/** Short names on the bar; the list below it has the full ones. */
const SHORT: Record<string, string> = {
  'astronomical-dusk': 'Dark',
  'lineup-start': 'Start',
  'lineup-peak': 'Peak',
  'lineup-end': 'End',
  moonrise: 'Moon',
  'tide-cut-off': 'Tide',
  'astronomical-dawn': 'Dawn',
};

/** Events that end shooting of the sky (or of everything, for the tide). */
export const DEADLINE_KINDS = new Set(['lineup-end', 'moonrise', 'tide-cut-off', 'astronomical-dawn']);

/** Pixels a label character takes at the bar's 11 px labels (an estimate; lanes keep them apart). */
const PX_PER_CHAR = 6.4;
const LANE_HEIGHT = 14;

/** The timeline bar in CSS pixels. */
export interface TimelineBar {
  width: number;
  height: number;
  barY: number;
  layout: TimelineBarLayout;
  labels: Array<{ x: number; y: number; text: string; deadline: boolean }>;
  hours: Array<{ x: number; label: string }>;
  /** Events with their full name and local clock time, in order. */
  list: Array<{ kind: string; label: string; clock: string; deadline: boolean }>;
}

/** Time shown either side of the shooting in the close-up bar, ms. */
const FOCUS_PAD_MS = 10 * 60_000;

/**
 * The night's timeline of a plan as a horizontal bar at a width: blocks as boxes (late ones
 * flagged), events as ticks with labels spread over two lanes above and two below (a label with
 * no room is left out; the list below the bar has them all), full local hours along the bottom.
 * With `focus`, only the shooting and the events within 10 minutes of it: a close-up.
 */
export function timelineBar(plan: ShotPlan, width: number, focus = false): TimelineBar {
  const tz = plan.timezone;
  const late = new Set(plan.timeline.warnings.map((w) => w.blockIndex));
  const blocks = plan.timeline.blocks.map((b) => ({ kind: b.kind, label: b.label, startMs: Date.parse(b.start), endMs: Date.parse(b.end), late: late.has(b.index) }));
  let events = plan.timeline.events;
  if (focus) {
    const from = Math.min(Date.parse(plan.lineup.start), ...blocks.map((b) => b.startMs)) - FOCUS_PAD_MS;
    const to = Math.max(Date.parse(plan.lineup.end), ...blocks.map((b) => b.endMs)) + FOCUS_PAD_MS;
    events = events.filter((e) => Date.parse(e.at) >= from && Date.parse(e.at) <= to);
  }
  const texts = events.map((e) => `${SHORT[e.kind] ?? e.label} ${clockOf(e.at, tz)}`);
  const layout = timelineBarLayout(
    events.map((e) => ({ kind: e.kind, label: e.label, atMs: Date.parse(e.at) })),
    blocks,
    width,
    { labelWidths: texts.map((t) => t.length * PX_PER_CHAR), lanes: 4, labelGap: 6, dropOverflow: true },
  );
  const barY = 2 * LANE_HEIGHT + 6;
  const barHeight = 22;
  const laneY = [barY - 4, barY - 4 - LANE_HEIGHT, barY + barHeight + 26, barY + barHeight + 26 + LANE_HEIGHT];
  const spanHours = (layout.endMs - layout.startMs) / 3_600_000;
  const every = [1, 2, 3, 4, 6, 12].find((n) => spanHours / n <= Math.max(3, width / 70)) ?? 12;
  const hourTicks = focus && spanHours < 3
    ? quarterHours(layout.startMs, layout.endMs, tz)
    : localHourTicks(layout.startMs, layout.endMs, tz, every).map((h) => ({ atMs: h.atMs, label: h.label }));
  return {
    width,
    height: laneY[3]! + 4,
    barY,
    layout,
    labels: layout.events.flatMap((e, i) => (e.lane < 0 ? [] : [{ x: e.labelX, y: laneY[e.lane] ?? barY, text: texts[i] ?? e.label, deadline: DEADLINE_KINDS.has(e.kind) }])),
    hours: hourTicks.map((h) => ({ x: ((h.atMs - layout.startMs) / (layout.endMs - layout.startMs)) * width, label: h.label })),
    list: plan.timeline.events.map((e) => ({ kind: e.kind, label: e.label, clock: `${clockOf(e.at, tz)} ${zoneOf(e.at, tz)}`, deadline: DEADLINE_KINDS.has(e.kind) })),
  };
}

/** Local quarter hours ('HH:mm') across a short span, for the close-up bar. */
function quarterHours(startMs: number, endMs: number, timeZone: string): Array<{ atMs: number; label: string }> {
  const step = 15 * 60_000;
  const out: Array<{ atMs: number; label: string }> = [];
  for (let ms = Math.ceil(startMs / step) * step; ms <= endMs; ms += step) out.push({ atMs: ms, label: clockOf(new Date(ms), timeZone) });
  return out;
}

/** The whole night's bar and the close-up of the shooting, for the store's plan at the measured width. */
export function useShotPlanTimeline(plan: Ref<ShotPlan | null>, width: Ref<number>) {
  return {
    night: computed<TimelineBar | null>(() => (plan.value ? timelineBar(plan.value, width.value) : null)),
    shooting: computed<TimelineBar | null>(() => (plan.value ? timelineBar(plan.value, width.value, true) : null)),
  };
}
