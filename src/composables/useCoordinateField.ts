import { computed, ref, watch } from 'vue';
import { formatDecimalDegrees, formatDms, parseCoordinates, type GeoPoint } from '../../shared/geo';
import { usePlannerStore, type PinKind } from '@/stores/planner';

/**
 * The typed or pasted coordinates of one pin: the text follows the pin while the user is not
 * editing it; applying parses it (decimal or DMS forms) and moves the pin, or keeps the text and
 * shows what is wrong.
 */
export function useCoordinateField(kind: PinKind) {
  const store = usePlannerStore();
  const text = ref('');
  const error = ref('');
  const editing = ref(false);
  const point = computed(() => store.point(kind));

  watch(point, (p) => {
    if (editing.value) return;
    text.value = p ? formatDecimalDegrees(p, 6) : '';
    error.value = '';
  }, { immediate: true });

  /** The pin in degrees, minutes and seconds, for reading beside the field. */
  const dms = computed(() => (point.value ? formatDms(point.value, 1) : ''));

  function onInput(value: string): void {
    editing.value = true;
    text.value = value;
    if (error.value && value.trim() === '') error.value = '';
  }

  /** Parses the text; on success moves the pin and returns the point, otherwise shows the error. */
  function apply(): GeoPoint | null {
    const current = point.value;
    if (text.value.trim() === '' && !current) {
      editing.value = false;
      error.value = '';
      return null;
    }
    const result = parseCoordinates(text.value);
    if (!result.ok) {
      error.value = result.error;
      return null;
    }
    error.value = '';
    editing.value = false;
    const p = { lat: result.lat, lon: result.lon };
    store.setPin(kind, p);
    text.value = formatDecimalDegrees(p, 6);
    return p;
  }

  /** Leaving the field applies a changed text; an unchanged one is left alone. */
  function onBlur(): GeoPoint | null {
    if (!editing.value) return null;
    const unchanged = point.value !== null && text.value === formatDecimalDegrees(point.value, 6);
    if (unchanged) {
      editing.value = false;
      return null;
    }
    return apply();
  }

  return { text, error, dms, point, onInput, apply, onBlur };
}
