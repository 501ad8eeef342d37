import { computed, ref, watch } from 'vue';
import { useMessage } from 'naive-ui';
import { MAX_TIDE_TEXT_CHARS, parseTideTimes, type TideParseResult } from '../../shared/tide';
import { ApiError } from '@/api/client';
import { useSightlineDetailStore, type TidePasteWarning } from '@/stores/sightlineDetail';
import { formatLocalTime } from '../../shared/sky';

/** Most lines the preview lists one by one. */
export const TIDE_PREVIEW_MAX_LINES = 400;

/** A line of the paste as the preview shows it. */
export interface TidePreviewLine {
  line: number;
  text: string;
  error: string | null;
  warning: string | null;
}

/**
 * The tide times paste box: a live preview with shared/tide's parser (errors and warnings per
 * line, in the site's zone) and Save, which the server refuses whole if any line is bad.
 */
export function useTidePaste() {
  const detail = useSightlineDetailStore();
  const message = useMessage();
  const text = ref('');
  const saving = ref(false);
  const serverErrors = ref<Record<number, string>>({});
  const serverMessage = ref('');
  const savedWarnings = ref<TidePasteWarning[]>([]);

  watch(text, () => {
    serverErrors.value = {};
    serverMessage.value = '';
  });

  const parse = computed<{ result: TideParseResult | null; error: string }>(() => {
    if (!text.value.trim()) return { result: null, error: '' };
    if (text.value.length > MAX_TIDE_TEXT_CHARS) return { result: null, error: `At most ${MAX_TIDE_TEXT_CHARS} characters in one paste` };
    try {
      return { result: parseTideTimes(text.value, detail.timeZone), error: '' };
    } catch (error) {
      return { result: null, error: (error as Error).message };
    }
  });

  const lines = computed<TidePreviewLine[]>(() => {
    const result = parse.value.result;
    if (!result) return [];
    const errors = new Map(result.errors.map((e) => [e.line, e.message]));
    const warnings = new Map(result.warnings.map((w) => [w.line, w.message]));
    return text.value.split(/\r\n|\r|\n/).slice(0, TIDE_PREVIEW_MAX_LINES).map((t, i) => ({
      line: i + 1,
      text: t,
      error: serverErrors.value[i + 1] ?? errors.get(i + 1) ?? null,
      warning: warnings.get(i + 1) ?? null,
    }));
  });

  const counts = computed(() => {
    const r = parse.value.result;
    return { events: r?.events.length ?? 0, errors: (r?.errors.length ?? 0) + Object.keys(serverErrors.value).length, warnings: r?.warnings.length ?? 0 };
  });

  const span = computed(() => {
    const events = parse.value.result?.events ?? [];
    if (events.length === 0) return '';
    const tz = detail.timeZone;
    return `${formatLocalTime(new Date(events[0]!.at), tz)} to ${formatLocalTime(new Date(events[events.length - 1]!.at), tz)}`;
  });

  const canSave = computed(() => counts.value.events > 0 && counts.value.errors === 0 && !saving.value);

  async function save(): Promise<void> {
    if (!canSave.value) return;
    saving.value = true;
    try {
      const count = counts.value.events;
      savedWarnings.value = await detail.pasteTideTimes(text.value);
      text.value = '';
      message.success(`Saved ${count} tide times`);
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      const byLine: Record<number, string> = {};
      for (const [path, msg] of Object.entries(error.fields)) {
        const m = /^lines\.(\d+)$/.exec(path);
        if (m) byLine[Number(m[1])] = msg.replace(/^Line \d+: /, '');
      }
      serverErrors.value = byLine;
      serverMessage.value = error.message;
    } finally {
      saving.value = false;
    }
  }

  return { text, parse, lines, counts, span, canSave, saving, save, serverMessage, savedWarnings };
}
