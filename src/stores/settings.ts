import { defineStore } from 'pinia';
import { ref, watch } from 'vue';

/** How lengths are shown. Values are always stored and computed in metres. */
export type UnitSystem = 'metric' | 'imperial';
const UNITS_KEY = 'gnomon.units';

function readStoredUnits(): UnitSystem {
  try {
    return localStorage.getItem(UNITS_KEY) === 'imperial' ? 'imperial' : 'metric';
  } catch {
    return 'metric';
  }
}

/** Display settings of this browser (remembered in localStorage). */
export const useSettingsStore = defineStore('settings', () => {
  const units = ref<UnitSystem>(readStoredUnits());

  watch(units, (value) => {
    try { localStorage.setItem(UNITS_KEY, value); } catch { /* private mode: not remembered */ }
  });

  return { units };
});
