import { computed, reactive, ref, watch } from 'vue';
import { useMessage } from 'naive-ui';
import { MAX_TIDE_RULE_HOURS, tideRuleSchema, type TideRule } from '../../shared/tide';
import { ApiError } from '@/api/client';
import { useSightlineDetailStore } from '@/stores/sightlineDetail';

type RuleField = 'mode' | 'hoursBefore' | 'hoursAfter' | 'note';
export type TideRuleMode = 'none' | TideRule['mode'];

/** 'Reachable from 2.5 h before to 2 h after each low water.' */
export function describeTideRule(rule: TideRule | null): string {
  if (!rule) return 'No tide rule: tides do not decide when this spot can be reached.';
  const h = (n: number) => `${Number(n.toFixed(2))} h`;
  return rule.mode === 'around-low'
    ? `Reachable from ${h(rule.hoursBefore)} before to ${h(rule.hoursAfter)} after each low water.`
    : `Reachable except from ${h(rule.hoursBefore)} before to ${h(rule.hoursAfter)} after each high water.`;
}

/** The tide rule form: mode, hours before and after, note; checked with the shared schema. */
export function useTideRuleForm() {
  const detail = useSightlineDetailStore();
  const message = useMessage();
  const form = reactive({ mode: 'none' as TideRuleMode, hoursBefore: 2 as number | null, hoursAfter: 2 as number | null, note: '' });
  const errors = ref<Partial<Record<RuleField, string>>>({});
  const general = ref('');
  const saving = ref(false);

  function resetFromSaved(): void {
    const rule = detail.sightline?.tideRule ?? null;
    form.mode = rule?.mode ?? 'none';
    form.hoursBefore = rule?.hoursBefore ?? 2;
    form.hoursAfter = rule?.hoursAfter ?? 2;
    form.note = rule?.note ?? '';
    errors.value = {};
    general.value = '';
  }
  watch(() => [detail.sightline?.id, JSON.stringify(detail.sightline?.tideRule ?? null)], resetFromSaved, { immediate: true });

  const saved = computed(() => describeTideRule(detail.sightline?.tideRule ?? null));
  const anchor = computed(() => (form.mode === 'except-around-high' ? 'high water' : 'low water'));

  /** The rule the form describes, or null for no rule; undefined when the form has errors. */
  function checkedRule(): TideRule | null | undefined {
    errors.value = {};
    general.value = '';
    if (form.mode === 'none') return null;
    const parsed = tideRuleSchema.safeParse({
      mode: form.mode,
      hoursBefore: form.hoursBefore ?? Number.NaN,
      hoursAfter: form.hoursAfter ?? Number.NaN,
      ...(form.note.trim() ? { note: form.note.trim() } : {}),
    });
    if (parsed.success) return parsed.data;
    const e: Partial<Record<RuleField, string>> = {};
    for (const issue of parsed.error.issues) {
      const key = String(issue.path[0] ?? 'mode') as RuleField;
      e[key] ??= issue.message;
    }
    errors.value = e;
    return undefined;
  }

  async function save(): Promise<void> {
    const rule = checkedRule();
    if (rule === undefined || saving.value) return;
    saving.value = true;
    try {
      await detail.saveTideRule(rule);
      message.success(rule ? 'Tide rule saved' : 'Tide rule removed');
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      const e: Partial<Record<RuleField, string>> = {};
      for (const [path, text] of Object.entries(error.fields)) {
        const key = path.replace(/^rule\.?/, '') as RuleField;
        if (['mode', 'hoursBefore', 'hoursAfter', 'note'].includes(key)) e[key] = text;
      }
      errors.value = e;
      if (Object.keys(e).length === 0) general.value = error.message;
    } finally {
      saving.value = false;
    }
  }

  function feedback(field: RuleField): { validationStatus?: 'error'; feedback?: string } {
    const text = errors.value[field];
    return text ? { validationStatus: 'error', feedback: text } : {};
  }

  return { form, errors, general, saving, saved, anchor, save, resetFromSaved, feedback, maxHours: MAX_TIDE_RULE_HOURS };
}
