import { computed } from 'vue';
import { useSettingsStore, type UnitSystem } from '@/stores/settings';

/** International foot, metres (exact by definition, 1959). */
export const METRES_PER_FOOT = 0.3048;
/** International mile, metres (exact: 5280 ft). */
export const METRES_PER_MILE = 1609.344;

/** A height in metres as a number in the display unit (m or ft). */
export function heightToDisplay(metres: number, units: UnitSystem): number {
  return units === 'imperial' ? metres / METRES_PER_FOOT : metres;
}

/** A number in the display unit (m or ft) as metres. */
export function heightFromDisplay(value: number, units: UnitSystem): number {
  return units === 'imperial' ? value * METRES_PER_FOOT : value;
}

/** A height with its unit, e.g. '12.5 m' or '41 ft'. */
export function formatHeight(metres: number, units: UnitSystem, decimals = 1): string {
  const v = heightToDisplay(metres, units);
  return `${trimZeros(v.toFixed(decimals))} ${units === 'imperial' ? 'ft' : 'm'}`;
}

/** A horizontal distance: metres under 1 km, else km (metric); feet under 0.1 mi, else miles. */
export function formatDistance(metres: number, units: UnitSystem): string {
  if (units === 'imperial') {
    const miles = metres / METRES_PER_MILE;
    if (miles < 0.1) return `${Math.round(metres / METRES_PER_FOOT)} ft`;
    return `${miles.toFixed(miles < 10 ? 2 : 1)} mi`;
  }
  if (metres < 1000) return `${Math.round(metres)} m`;
  const km = metres / 1000;
  return `${km.toFixed(km < 10 ? 2 : 1)} km`;
}

function trimZeros(text: string): string {
  return text.includes('.') ? text.replace(/\.?0+$/, '') : text;
}

/** The user's unit setting with converters bound to it. */
export function useUnits() {
  const settings = useSettingsStore();
  const units = computed(() => settings.units);
  const heightUnit = computed(() => (settings.units === 'imperial' ? 'ft' : 'm'));
  return {
    units,
    heightUnit,
    toDisplay: (metres: number) => heightToDisplay(metres, settings.units),
    fromDisplay: (value: number) => heightFromDisplay(value, settings.units),
    height: (metres: number, decimals = 1) => formatHeight(metres, settings.units, decimals),
    distance: (metres: number) => formatDistance(metres, settings.units),
  };
}
