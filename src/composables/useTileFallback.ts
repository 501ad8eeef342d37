import { onBeforeUnmount, readonly, ref } from 'vue';

/** Tile errors, with no tile loaded, after which the map switches to its offline base. */
export const TILE_ERRORS_BEFORE_FALLBACK = 3;
/** With no tile loaded this long after the layer starts, the map switches to its offline base, ms. */
export const TILE_SILENCE_BEFORE_FALLBACK_MS = 10_000;

/**
 * Watches the tile layer's load and error events and says when the tiles are unavailable (a few
 * errors and no tile loaded, no tile within a while, or the browser is offline). A tile that
 * loads later brings the tiles back.
 */
export function useTileFallback() {
  const offline = ref(typeof navigator !== 'undefined' && navigator.onLine === false);
  const errors = ref(0);
  const loads = ref(0);
  let timer: ReturnType<typeof setTimeout> | undefined;

  function restartSilenceTimer(): void {
    clearTimeout(timer);
    timer = setTimeout(() => { if (loads.value === 0) offline.value = true; }, TILE_SILENCE_BEFORE_FALLBACK_MS);
  }

  function onTileLoad(): void {
    loads.value += 1;
    offline.value = false;
  }

  function onTileError(): void {
    errors.value += 1;
    if (loads.value === 0 && errors.value >= TILE_ERRORS_BEFORE_FALLBACK) offline.value = true;
  }

  /** A new tile source was chosen: count afresh. */
  function reset(): void {
    errors.value = 0;
    loads.value = 0;
    offline.value = typeof navigator !== 'undefined' && navigator.onLine === false;
    restartSilenceTimer();
  }

  const goOffline = () => { offline.value = true; };
  window.addEventListener('offline', goOffline);
  restartSilenceTimer();
  onBeforeUnmount(() => {
    clearTimeout(timer);
    window.removeEventListener('offline', goOffline);
  });

  return { offline: readonly(offline), errors: readonly(errors), loads: readonly(loads), onTileLoad, onTileError, reset };
}
