import { computed, reactive } from 'vue';
import type { z } from 'zod';
import { catalogueTargetRefSchema, customTargetSchema, type TargetRef } from '../../shared/schemas/lineup';
import {
  DEFAULT_LEAD_DAYS,
  DEFAULT_WATCH_MIN_DURATION_MIN,
  DEFAULT_WATCH_MIN_SCORE,
  MAX_LEAD_DAYS,
  MAX_LEAD_TIMES,
  WEEKDAYS,
  weekdayNames,
  watchInputSchema,
  watchUpdateSchema,
  type Watch,
  type WatchInput,
  type WatchUpdate,
} from '../../shared/schemas/watch';
import { findTarget } from '../../shared/sky';
import { ApiError } from '@/api/client';
import { useFieldErrors } from './useFieldErrors';
import { parseSexagesimal } from './useLineupSearchForm';
import { leadDayLabel } from './useWatchLabels';

/** The fields of the watch form that can carry a message. */
export type WatchFormField =
  | 'target' | 'customName' | 'customRa' | 'customDec'
  | 'minScore' | 'minDurationMin' | 'reachableOnly' | 'weekdays' | 'leadDays' | 'paused' | 'maxCloudPct';

/** The target a new watch starts with when the sightline's own is not in the catalogue. */
const FALLBACK_TARGET_ID = 'galactic-centre';

/** The form shows the score as a percentage, so its message says so (the API's says 0 to 1). */
const MIN_SCORE_MESSAGE = 'Lowest score is 0 to 100 %';

/** The cloud limit a form offers when it is switched on, % (mean total cloud over the lineup window). */
export const DEFAULT_MAX_CLOUD_PCT = 30;

/** Mon..Sun checkboxes, ISO weekday numbers as values. */
export const WEEKDAY_OPTIONS = WEEKDAYS.map((d) => ({ label: weekdayNames[d - 1], value: d }));

/** Maps a field path of a watch request (client or server) to the form field that shows it. */
export function watchFieldOfPath(path: string): WatchFormField | null {
  if (path === 'target' || path === 'target.id') return 'target';
  if (path === 'target.name') return 'customName';
  if (path === 'target.raHours') return 'customRa';
  if (path === 'target.decDeg') return 'customDec';
  const head = path.split('.')[0];
  switch (head) {
    case 'minScore': case 'minDurationMin': case 'reachableOnly': case 'weekdays': case 'leadDays': case 'paused': case 'maxCloudPct':
      return head;
    default:
      return null;
  }
}

/**
 * The watch form, for a new watch and for editing one: target (catalogue or RA/Dec), minimum
 * score (as a percentage), minimum duration, reachable-only, nights of the week, lead times,
 * paused, and a cloud limit (switched on or off; a number 0..100 % when on). Checks with the shared schemas and places their messages, and the server's, beside the
 * fields.
 */
export function useWatchForm() {
  const form = reactive({
    targetMode: 'catalogue' as 'catalogue' | 'custom',
    targetId: FALLBACK_TARGET_ID,
    customName: 'Custom target',
    customRa: '',
    customDec: '',
    /** Minimum score, 0..100 %. */
    minScorePercent: Math.round(DEFAULT_WATCH_MIN_SCORE * 100) as number | null,
    minDurationMin: DEFAULT_WATCH_MIN_DURATION_MIN as number | null,
    reachableOnly: false,
    weekdays: [...WEEKDAYS] as number[],
    leadDays: [...DEFAULT_LEAD_DAYS] as number[],
    paused: false,
    /** Whether the reminders wait for a clear enough sky outlook. */
    cloudLimitOn: false,
    /** The cloud limit, 0..100 % (used when cloudLimitOn). */
    maxCloudPct: DEFAULT_MAX_CLOUD_PCT as number | null,
  });
  const errors = useFieldErrors<WatchFormField>();

  /** Lead time choices 0..MAX_LEAD_DAYS; others are disabled once MAX_LEAD_TIMES are chosen. */
  const leadOptions = computed(() => {
    const full = form.leadDays.length >= MAX_LEAD_TIMES;
    return Array.from({ length: MAX_LEAD_DAYS + 1 }, (_, d) => ({
      label: leadDayLabel(d).replace(/^./, (c) => c.toUpperCase()),
      value: d,
      disabled: full && !form.leadDays.includes(d),
    }));
  });

  /** A new watch's values: the given target and the schema's default conditions. */
  function fillDefaults(targetId?: string | null): void {
    errors.clear();
    Object.assign(form, {
      targetMode: 'catalogue',
      targetId: targetId && findTarget(targetId) ? targetId : FALLBACK_TARGET_ID,
      customName: 'Custom target',
      customRa: '',
      customDec: '',
      minScorePercent: Math.round(DEFAULT_WATCH_MIN_SCORE * 100),
      minDurationMin: DEFAULT_WATCH_MIN_DURATION_MIN,
      reachableOnly: false,
      weekdays: [...WEEKDAYS],
      leadDays: [...DEFAULT_LEAD_DAYS],
      paused: false,
      cloudLimitOn: false,
      maxCloudPct: DEFAULT_MAX_CLOUD_PCT,
    });
  }

  /** An existing watch's values, for editing. */
  function fillFrom(watch: Watch): void {
    errors.clear();
    const t = watch.target;
    Object.assign(form, {
      targetMode: 'id' in t ? 'catalogue' : 'custom',
      targetId: 'id' in t ? t.id : FALLBACK_TARGET_ID,
      customName: 'id' in t ? 'Custom target' : t.name,
      customRa: 'id' in t ? '' : String(t.raHours),
      customDec: 'id' in t ? '' : String(t.decDeg),
      minScorePercent: Math.round(watch.minScore * 1000) / 10,
      minDurationMin: watch.minDurationMin,
      reachableOnly: watch.reachableOnly,
      weekdays: [...watch.weekdays],
      leadDays: [...watch.leadDays],
      paused: watch.paused,
      cloudLimitOn: watch.maxCloudPct !== null,
      maxCloudPct: watch.maxCloudPct ?? DEFAULT_MAX_CLOUD_PCT,
    });
  }

  /** The target the form names, checked with the shared schema, or null with messages beside the target fields. */
  function target(): TargetRef | null {
    if (form.targetMode === 'catalogue') {
      const parsed = catalogueTargetRefSchema.safeParse({ id: form.targetId });
      if (parsed.success) return parsed.data;
      errors.fields.target = 'Choose a target from the catalogue';
      return null;
    }
    const ra = parseSexagesimal(form.customRa);
    const dec = parseSexagesimal(form.customDec);
    if (ra === null || !(ra >= 0 && ra < 24)) errors.fields.customRa = 'RA in hours, 0 to below 24 (17.76 or 17 45 37)';
    if (dec === null || !(dec >= -90 && dec <= 90)) errors.fields.customDec = 'Dec in degrees, -90 to 90 (-28.94 or -28 56 10)';
    const parsed = customTargetSchema.safeParse({ raHours: ra ?? 0, decDeg: dec ?? 0, name: form.customName });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const field = watchFieldOfPath(['target', ...issue.path.map(String)].join('.'));
        if (field) errors.fields[field] ??= issue.message;
      }
    }
    return parsed.success && ra !== null && dec !== null ? parsed.data : null;
  }

  /** The conditions as the API has them (score as a fraction; no cloud limit is null). NaN marks an empty number box. */
  function conditions() {
    return {
      minScore: form.minScorePercent === null ? Number.NaN : form.minScorePercent / 100,
      minDurationMin: form.minDurationMin ?? Number.NaN,
      reachableOnly: form.reachableOnly,
      weekdays: [...form.weekdays],
      leadDays: [...form.leadDays],
      paused: form.paused,
      maxCloudPct: form.cloudLimitOn ? (form.maxCloudPct ?? Number.NaN) : null,
    };
  }

  /** Places a schema's messages beside the fields; the rest goes to the general message. */
  function place(issues: readonly z.core.$ZodIssue[]): void {
    const rest: string[] = [];
    for (const issue of issues) {
      const path = issue.path.map(String).join('.');
      const field = watchFieldOfPath(path);
      if (field) errors.fields[field] ??= field === 'minScore' ? MIN_SCORE_MESSAGE : issue.message;
      else rest.push(issue.message);
    }
    errors.state.general = rest.join(' · ');
  }

  /** Checks the form for a new watch on a sightline; returns the request body or null. */
  function buildInput(sightlineId: string): WatchInput | null {
    errors.clear();
    const t = target();
    const parsed = watchInputSchema.safeParse({ sightlineId, ...(t ? { target: t } : {}), ...conditions() });
    if (!parsed.success) place(parsed.error.issues);
    return parsed.success && t ? parsed.data : null;
  }

  /** Checks the form as a change to a watch (every field sent); returns the body or null. */
  function buildUpdate(): WatchUpdate | null {
    errors.clear();
    const t = target();
    const parsed = watchUpdateSchema.safeParse({ ...(t ? { target: t } : {}), ...conditions() });
    if (!parsed.success) place(parsed.error.issues);
    return parsed.success && t ? parsed.data : null;
  }

  /** Shows an error of a submit beside the fields; returns false when it is not an API error. */
  function takeServer(error: unknown): boolean {
    errors.clear();
    if (!(error instanceof ApiError)) return false;
    const rest: string[] = [];
    let placed = false;
    for (const [path, message] of Object.entries(error.fields)) {
      const field = watchFieldOfPath(path);
      if (field) {
        errors.fields[field] = field === 'minScore' ? MIN_SCORE_MESSAGE : message;
        placed = true;
      } else rest.push(message);
    }
    errors.state.general = !placed || error.code !== 'validation' ? [error.message, ...rest].join(' · ') : rest.join(' · ');
    return true;
  }

  return { form, errors, leadOptions, fillDefaults, fillFrom, buildInput, buildUpdate, takeServer, feedback: errors.feedback };
}
export type WatchForm = ReturnType<typeof useWatchForm>;
