import { computed, onBeforeUnmount, ref, watch } from 'vue';
import type { LineupSearchRun } from '@/stores/lineups';

/** Tenths of a second: how often the elapsed time of a running search is redrawn, ms. */
const TICK_MS = 100;

/** Elapsed time of a running search, ticking while it runs ('0.4 s'). */
export function useLineupSearchProgress(run: LineupSearchRun) {
  const now = ref(Date.now());
  let timer: ReturnType<typeof setInterval> | undefined;

  function stop(): void {
    if (timer !== undefined) clearInterval(timer);
    timer = undefined;
  }

  watch(() => run.running, (running) => {
    stop();
    if (running) {
      now.value = Date.now();
      timer = setInterval(() => { now.value = Date.now(); }, TICK_MS);
    }
  }, { immediate: true });
  onBeforeUnmount(stop);

  const elapsedText = computed(() => {
    const ms = run.running ? Math.max(0, now.value - run.startedAtMs) : run.lastDurationMs;
    return `${(ms / 1000).toFixed(1)} s`;
  });

  return { elapsedText };
}
