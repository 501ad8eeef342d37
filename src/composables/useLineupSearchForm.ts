import { computed, reactive, ref, watch, type Ref } from 'vue';
import { DateTime } from 'luxon';
import { MAX_SEARCH_RANGE_DAYS, type LineupSearchRequestBody } from '../../shared/schemas/lineup';
import type { Sightline } from '../../shared/schemas/sightline';
import { findTarget } from '../../shared/sky';

/** The fields of the search form that can carry a message. */
export type LineupFormField = 'target' | 'customName' | 'customRa' | 'customDec' | 'range' | 'sunLimit' | 'maxIllumination' | 'minDuration' | 'bandHeight';

/** Default Sun limit, deg (astronomical twilight). */
export const DEFAULT_FORM_SUN_LIMIT_DEG = -18;
/** Default largest Moon illumination when the Moon may be up, 0..1. */
export const DEFAULT_FORM_MAX_ILLUMINATION = 0.3;
/** Default shortest lineup, minutes. */
export const DEFAULT_FORM_MIN_DURATION_MIN = 5;

/**
 * Reads a sexagesimal or decimal angle: '17.76', '17 45 37.2', '17:45:37.2', '17h45m37s',
 * '-28°56′10″', '-28d56m10s'. Returns null for text that is not one.
 */
export function parseSexagesimal(text: string): number | null {
  const t = text.trim();
  if (!t) return null;
  const negative = /^[-−]/.test(t);
  const body = t.replace(/^[-+−]/, '').replace(/[hdms°′″'"º:]/gi, ' ').trim();
  const parts = body.split(/\s+/);
  if (parts.length < 1 || parts.length > 3 || parts.some((p) => !/^\d+(\.\d+)?$/.test(p))) return null;
  const [a, b = '0', c = '0'] = parts;
  const minutes = Number(b);
  const seconds = Number(c);
  if ((parts.length > 1 && minutes >= 60) || (parts.length > 2 && seconds >= 60)) return null;
  const value = Number(a) + minutes / 60 + seconds / 3600;
  return negative ? -value : value;
}

/** Maps a server field path of the search request to the form field that shows it. */
export function formFieldOfPath(path: string): LineupFormField | null {
  if (path === 'target.id' || path === 'target') return 'target';
  if (path === 'target.name') return 'customName';
  if (path === 'target.raHours') return 'customRa';
  if (path === 'target.decDeg') return 'customDec';
  if (path === 'from' || path === 'to') return 'range';
  if (path === 'conditions.sunMaxAltDeg') return 'sunLimit';
  if (path.startsWith('conditions.moon')) return 'maxIllumination';
  if (path === 'conditions.minDurationMin') return 'minDuration';
  if (path.startsWith('sightline.bandHeightDeg')) return 'bandHeight';
  return null;
}

function todayIn(timeZone: string): DateTime {
  return DateTime.now().setZone(timeZone).startOf('day');
}

/**
 * The lineup search form of a sightline: target (catalogue or custom RA/Dec), date range of
 * nights in the site's zone, conditions and band height; checks it and builds the request body.
 * Dates name nights: the range runs from local noon of the first date to local noon after the
 * last, so the last date's night is searched too.
 */
export function useLineupSearchForm(sightline: Ref<Sightline | null>) {
  const form = reactive({
    targetMode: 'catalogue' as 'catalogue' | 'custom',
    targetId: 'galactic-centre',
    customName: 'Custom target',
    customRa: '',
    customDec: '',
    /** First and last night, 'YYYY-MM-DD', in the site zone. */
    range: null as [string, string] | null,
    sunLimitDeg: DEFAULT_FORM_SUN_LIMIT_DEG,
    moonMode: 'down' as 'down' | 'illumination',
    maxIllumination: DEFAULT_FORM_MAX_ILLUMINATION,
    minDurationMin: DEFAULT_FORM_MIN_DURATION_MIN as number | null,
    bandHeightDeg: 20 as number | null,
  });
  const errors = ref<Partial<Record<LineupFormField, string>>>({});
  const timeZone = computed(() => sightline.value?.timezone ?? 'UTC');

  /** Default range: the next 12 months of nights from today in the site zone. */
  function defaultRange(): [string, string] {
    const today = todayIn(timeZone.value);
    return [today.toISODate()!, today.plus({ months: 12 }).toISODate()!];
  }

  function resetFor(s: Sightline | null): void {
    if (!s) return;
    form.targetMode = 'catalogue';
    form.targetId = findTarget(s.targetId) ? s.targetId : 'galactic-centre';
    form.bandHeightDeg = s.bandHeightDeg;
    form.range = defaultRange();
    errors.value = {};
  }
  watch(() => sightline.value?.id, () => resetFor(sightline.value), { immediate: true });

  const targetName = computed(() => (form.targetMode === 'custom' ? form.customName.trim() || 'Custom target' : findTarget(form.targetId)?.name ?? form.targetId));

  /** Checks the form; fills `errors` and returns the body, or null when something is wrong. */
  function buildBody(): LineupSearchRequestBody | null {
    const s = sightline.value;
    const e: Partial<Record<LineupFormField, string>> = {};
    let target: LineupSearchRequestBody['target'] | null = null;
    if (form.targetMode === 'catalogue') {
      if (!findTarget(form.targetId)) e.target = 'Choose a target from the catalogue';
      else target = { id: form.targetId };
    } else {
      const ra = parseSexagesimal(form.customRa);
      const dec = parseSexagesimal(form.customDec);
      const name = form.customName.trim();
      if (ra === null || ra < 0 || ra >= 24) e.customRa = 'RA in hours, 0 to below 24 (17.76 or 17 45 37)';
      if (dec === null || dec < -90 || dec > 90) e.customDec = 'Dec in degrees, -90 to 90 (-28.94 or -28 56 10)';
      if (!name) e.customName = 'Name the custom target';
      else if (name.length > 80) e.customName = 'A name is at most 80 characters';
      if (ra !== null && dec !== null && !e.customRa && !e.customDec && !e.customName) target = { raHours: ra, decDeg: dec, name };
    }

    let from = '';
    let to = '';
    if (!form.range) e.range = 'Choose the first and last night';
    else {
      const start = DateTime.fromISO(`${form.range[0]}T12:00`, { zone: timeZone.value });
      const end = DateTime.fromISO(`${form.range[1]}T12:00`, { zone: timeZone.value }).plus({ days: 1 });
      if (!start.isValid || !end.isValid) e.range = 'Choose the first and last night';
      else if (end <= start) e.range = 'The last night must not be before the first';
      else if (end.diff(start, 'days').days > MAX_SEARCH_RANGE_DAYS) e.range = 'Search at most 10 years at once';
      else {
        from = start.toUTC().toISO()!;
        to = end.toUTC().toISO()!;
      }
    }

    if (!Number.isFinite(form.sunLimitDeg) || form.sunLimitDeg < -30 || form.sunLimitDeg > 0) e.sunLimit = 'Sun limit between -30 and 0 deg';
    if (form.moonMode === 'illumination' && !(form.maxIllumination >= 0 && form.maxIllumination <= 1)) e.maxIllumination = 'Illumination from 0 to 1';
    const minDuration = form.minDurationMin;
    if (minDuration === null || !Number.isFinite(minDuration) || minDuration < 0 || minDuration > 1440) e.minDuration = 'Minimum duration from 0 to 1440 min';
    const band = form.bandHeightDeg;
    if (band === null || !Number.isFinite(band) || band <= 0 || band > 90) e.bandHeight = 'Band height above 0 and at most 90 deg';

    errors.value = e;
    if (!s || Object.keys(e).length > 0 || !target) return null;
    const body: LineupSearchRequestBody = {
      sightlineId: s.id,
      target,
      from,
      to,
      conditions: {
        sunMaxAltDeg: form.sunLimitDeg,
        moon: form.moonMode === 'down' ? 'down' : { maxIllumination: form.maxIllumination },
        minDurationMin: minDuration!,
      },
    };
    // A band height other than the saved one goes as the sightline's geometry with that band.
    if (band !== s.bandHeightDeg) body.sightline = { vantage: s.vantage, landmark: s.landmark, bandHeightDeg: band! };
    return body;
  }

  /** Shows the server's per-field messages beside the fields they belong to; returns the rest. */
  function takeServerFields(fields: Record<string, string>): string[] {
    const rest: string[] = [];
    const e = { ...errors.value };
    for (const [path, message] of Object.entries(fields)) {
      const field = formFieldOfPath(path);
      if (field) e[field] = message;
      else rest.push(message);
    }
    errors.value = e;
    return rest;
  }

  function feedback(field: LineupFormField): { validationStatus?: 'error'; feedback?: string } {
    const message = errors.value[field];
    return message ? { validationStatus: 'error', feedback: message } : {};
  }

  return { form, errors, timeZone, targetName, buildBody, takeServerFields, feedback, resetFor, defaultRange };
}
