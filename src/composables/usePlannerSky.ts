import { computed, type UnwrapNestedRefs } from 'vue';
import { DateTime } from 'luxon';
import type { ObserverSite } from '../../shared/schemas/geometry';
import {
  findTarget,
  localDateOf,
  moonHorizontal,
  moonIllumination,
  nightReport,
  sunHorizontal,
  targetHorizontal,
  timeZoneForSite,
  toLocalInstant,
  TARGETS,
  type LocalInstant,
  type NightReport,
  type Target,
} from '../../shared/sky';
import { DEFAULT_TARGET_ID, usePlannerStore } from '@/stores/planner';

/** One body drawn as a ray from the vantage. */
export interface SkyRay {
  id: 'target' | 'sun' | 'moon';
  name: string;
  /** True azimuth, degrees [0, 360). */
  azimuthDeg: number;
  /** Apparent altitude, degrees. */
  altitudeDeg: number;
}

/** A labelled moment of the night, for the summary and the slider's marks. */
export interface NightMoment {
  key: string;
  label: string;
  ms: number;
  clock: string;
}

const HOUR_MS = 3_600_000;
const MINUTE_MS = 60_000;

/** Clock time in a zone, 'HH:mm'. */
export function clockTime(ms: number, timeZone: string): string {
  return DateTime.fromMillis(ms, { zone: timeZone }).toFormat('HH:mm');
}

/**
 * The sky over the vantage for the planner: the site's time zone, the chosen night (dusk to dawn
 * from the sky engine), the chosen instant within it, and the target's, Sun's and Moon's azimuth
 * and altitude then. All times are read in the site's zone, never the browser's.
 */
export function usePlannerSky() {
  const store = usePlannerStore();

  const site = computed<ObserverSite | null>(() => {
    const p = store.vantagePoint;
    if (!p) return null;
    const elevation = store.heights.vantageElevationM;
    const elevationM = elevation !== null && elevation >= -500 && elevation <= 9000 ? elevation : 0;
    return { lat: p.lat, lon: p.lon, elevationM };
  });

  const timeZone = computed(() => (site.value ? timeZoneForSite(site.value.lat, site.value.lon) : null));

  // The night's events move by seconds per kilometre: recompute only when the vantage moves about
  // a kilometre (0.01 deg) or the ground by 100 m, not on every pixel of a drag.
  const nightSiteKey = computed(() => {
    const s = site.value;
    return s ? `${s.lat.toFixed(2)}|${s.lon.toFixed(2)}|${Math.round(s.elevationM / 100) * 100}` : '';
  });

  /** Tonight at the site: the local date of twelve hours ago (the night runs noon to noon). */
  const tonight = computed(() => (timeZone.value ? localDateOf(new Date(Date.now() - 12 * HOUR_MS), timeZone.value) : null));
  const nightDate = computed(() => store.nightDate ?? tonight.value);

  const nightResult = computed<{ report: NightReport | null; error: string }>(() => {
    const key = nightSiteKey.value;
    const date = nightDate.value;
    const zone = timeZone.value;
    if (!key || !date || !zone) return { report: null, error: '' };
    const [lat, lon, elevationM] = key.split('|').map(Number) as [number, number, number];
    try {
      return { report: nightReport({ lat, lon, elevationM }, date, { timeZone: zone }), error: '' };
    } catch (error) {
      return { report: null, error: (error as Error).message };
    }
  });
  const night = computed(() => nightResult.value.report);

  /** The slider's span: sunset to sunrise, or the whole noon-to-noon window when the Sun does not set or rise. */
  const range = computed<{ startMs: number; endMs: number } | null>(() => {
    const n = night.value;
    if (!n) return null;
    const start = (n.sunset ?? n.window.start).utc.getTime();
    const end = (n.sunrise ?? n.window.end).utc.getTime();
    return end > start ? { startMs: start, endMs: end } : { startMs: n.window.start.utc.getTime(), endMs: n.window.end.utc.getTime() };
  });

  const defaultInstantMs = computed(() => {
    const n = night.value;
    if (!n) return null;
    return (n.astronomicalDusk ?? n.nauticalDusk ?? n.sunLowest.at).utc.getTime();
  });

  /** The chosen instant, inside the night's span. */
  const instantMs = computed<number | null>(() => {
    const r = range.value;
    if (!r) return null;
    const wanted = store.timeMs ?? defaultInstantMs.value ?? r.startMs;
    return Math.min(r.endMs, Math.max(r.startMs, wanted));
  });

  const instant = computed<LocalInstant | null>(() =>
    instantMs.value !== null && timeZone.value ? toLocalInstant(new Date(instantMs.value), timeZone.value) : null);

  /** 'yyyy-MM-dd HH:mm' and the zone label, e.g. 'IST'. */
  const instantLabel = computed(() => {
    if (!instant.value) return '';
    const dt = DateTime.fromMillis(instant.value.utc.getTime(), { zone: instant.value.timeZone });
    return `${dt.toFormat('ccc d LLL yyyy, HH:mm')} ${instant.value.zoneLabel}`;
  });

  const target = computed<Target>(() => findTarget(store.targetId) ?? findTarget(DEFAULT_TARGET_ID) ?? (TARGETS[0] as Target));

  const rays = computed<SkyRay[]>(() => {
    const s = site.value;
    const ms = instantMs.value;
    if (!s || ms === null) return [];
    const date = new Date(ms);
    const t = targetHorizontal(target.value, s, date);
    const sun = sunHorizontal(s, date);
    const moon = moonHorizontal(s, date);
    return [
      { id: 'target', name: target.value.name, azimuthDeg: t.azimuthDeg, altitudeDeg: t.altitudeDeg },
      { id: 'sun', name: 'Sun', azimuthDeg: sun.azimuthDeg, altitudeDeg: sun.altitudeDeg },
      { id: 'moon', name: 'Moon', azimuthDeg: moon.azimuthDeg, altitudeDeg: moon.altitudeDeg },
    ];
  });

  const moonLit = computed(() => (instantMs.value === null ? null : moonIllumination(new Date(instantMs.value))));

  /** Sunset, darkness, moonrise/moonset and sunrise of the night, in order. */
  const moments = computed<NightMoment[]>(() => {
    const n = night.value;
    const zone = timeZone.value;
    if (!n || !zone) return [];
    const out: NightMoment[] = [];
    const add = (key: string, label: string, at: LocalInstant | null) => {
      if (at) out.push({ key, label, ms: at.utc.getTime(), clock: clockTime(at.utc.getTime(), zone) });
    };
    add('sunset', 'Sunset', n.sunset);
    add('astronomical-dusk', 'Dark from', n.astronomicalDusk);
    add('astronomical-dawn', 'Dark until', n.astronomicalDawn);
    add('sunrise', 'Sunrise', n.sunrise);
    n.moonEvents.forEach((e, i) => add(`moon-${e.kind}-${i}`, e.kind === 'rise' ? 'Moonrise' : 'Moonset', e.at));
    return out.sort((a, b) => a.ms - b.ms);
  });

  /** Marks on the time slider: the start and end of darkness and each full hour's label every 2 h. */
  const sliderMarks = computed<Record<number, string>>(() => {
    const r = range.value;
    const zone = timeZone.value;
    if (!r || !zone) return {};
    const marks: Record<number, string> = {};
    let t = DateTime.fromMillis(r.startMs, { zone }).startOf('hour').plus({ hours: 1 });
    const stepHours = r.endMs - r.startMs > 14 * HOUR_MS ? 4 : 2;
    while (t.hour % stepHours !== 0) t = t.plus({ hours: 1 });
    for (; t.toMillis() < r.endMs - 20 * MINUTE_MS; t = t.plus({ hours: stepHours })) {
      if (t.toMillis() - r.startMs > 20 * MINUTE_MS) marks[t.toMillis()] = t.toFormat('HH:mm');
    }
    return marks;
  });

  function setInstant(ms: number): void {
    store.timeMs = Math.round(ms / MINUTE_MS) * MINUTE_MS;
  }

  function setNightDate(date: string | null): void {
    store.nightDate = date;
    store.timeMs = null;
  }

  return {
    site, timeZone, night, nightError: computed(() => nightResult.value.error), nightDate, tonight, range,
    instantMs, instant, instantLabel, target, rays, moonLit, moments, sliderMarks, setInstant, setNightDate,
  };
}

/** The sky as a component receives it: `reactive(usePlannerSky())`. */
export type PlannerSky = UnwrapNestedRefs<ReturnType<typeof usePlannerSky>>;
