import { defineStore } from 'pinia';
import { ref, watch } from 'vue';

export type ThemeMode = 'dark' | 'night-vision';
const STORAGE_KEY = 'gnomon.theme';

function readStoredMode(): ThemeMode {
  try {
    return localStorage.getItem(STORAGE_KEY) === 'night-vision' ? 'night-vision' : 'dark';
  } catch {
    return 'dark';
  }
}

/** The colour theme: dark by default, or the red night-vision theme; remembered in this browser. */
export const useThemeStore = defineStore('theme', () => {
  const mode = ref<ThemeMode>(readStoredMode());

  function toggleNightVision(): void {
    mode.value = mode.value === 'night-vision' ? 'dark' : 'night-vision';
  }

  watch(mode, (value) => {
    try { localStorage.setItem(STORAGE_KEY, value); } catch { /* private mode: not remembered */ }
    document.documentElement.dataset.theme = value;
  }, { immediate: true });

  return { mode, toggleNightVision };
});
