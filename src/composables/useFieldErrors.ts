import { reactive } from 'vue';
import { ApiError } from '@/api/client';

/**
 * Per-field messages for a form: filled from an ApiError's `fields`, shown beside each field;
 * `general` holds a message that belongs to no single field.
 */
export function useFieldErrors<K extends string>() {
  const fields = reactive<Partial<Record<K, string>>>({}) as Partial<Record<K, string>>;
  const state = reactive({ general: '' });

  function clear(): void {
    for (const key of Object.keys(fields)) delete fields[key as K];
    state.general = '';
  }

  /** Takes an error from a submit; returns true when it was shown, false to rethrow. */
  function take(error: unknown): boolean {
    clear();
    if (!(error instanceof ApiError)) return false;
    let placed = false;
    for (const [key, message] of Object.entries(error.fields)) {
      if (key === '_') continue;
      (fields as Record<string, string>)[key] = message;
      placed = true;
    }
    if (!placed || error.code !== 'validation') state.general = error.message;
    return true;
  }

  /** Naive UI form-item props for a field. */
  function feedback(key: K): { validationStatus?: 'error'; feedback?: string } {
    const message = fields[key];
    return message ? { validationStatus: 'error', feedback: message } : {};
  }

  return { fields, state, clear, take, feedback };
}
