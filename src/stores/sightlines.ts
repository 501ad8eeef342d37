import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { Sightline, SightlineInputBody } from '../../shared/schemas/sightline';
import type { Lineup } from '../../shared/schemas/lineup';
import * as sightlinesApi from '@/api/sightlines';
import type { SightlineChange } from '@/api/sightlines';

/** The signed-in user's saved sightlines. */
export const useSightlinesStore = defineStore('sightlines', () => {
  const sightlines = ref<Sightline[]>([]);
  const loading = ref(false);
  /** True once the list came back at least once. */
  const loaded = ref(false);
  /** Next good lineup per sightline id: undefined while loading, null when none in the coming year. */
  const nextLineup = ref<Record<string, { lineup: Lineup | null } | { error: string }>>({});

  function upsert(sightline: Sightline): void {
    const others = sightlines.value.filter((s) => s.id !== sightline.id);
    sightlines.value = [...others, sightline].sort((a, b) => a.name.localeCompare(b.name));
  }

  async function refresh(): Promise<void> {
    loading.value = true;
    try {
      sightlines.value = await sightlinesApi.listSightlines();
      loaded.value = true;
    } finally {
      loading.value = false;
    }
  }

  /** One sightline, fetched fresh (the list may be stale or not loaded). */
  async function get(id: string): Promise<Sightline> {
    const sightline = await sightlinesApi.getSightline(id);
    if (loaded.value) upsert(sightline);
    return sightline;
  }

  async function create(input: SightlineInputBody): Promise<Sightline> {
    const created = await sightlinesApi.createSightline(input);
    upsert(created);
    return created;
  }

  async function update(id: string, change: SightlineChange): Promise<Sightline> {
    const updated = await sightlinesApi.updateSightline(id, change);
    upsert(updated);
    return updated;
  }

  async function remove(id: string): Promise<void> {
    await sightlinesApi.deleteSightline(id);
    sightlines.value = sightlines.value.filter((s) => s.id !== id);
  }

  /** Asks the server for each listed sightline's next good lineup, one after another. */
  async function loadNextLineups(): Promise<void> {
    for (const s of sightlines.value) {
      try {
        const result = await sightlinesApi.fetchNextLineups(s.id, { count: 1 });
        nextLineup.value = { ...nextLineup.value, [s.id]: { lineup: result.lineups[0] ?? null } };
      } catch (error) {
        nextLineup.value = { ...nextLineup.value, [s.id]: { error: (error as Error).message } };
      }
    }
  }

  /** The next good lineups of one sightline for a target. */
  function nextLineupsFor(id: string, target: string, count: number) {
    return sightlinesApi.fetchNextLineups(id, { target, count });
  }

  return { sightlines, loading, loaded, nextLineup, refresh, get, create, update, remove, loadNextLineups, nextLineupsFor };
});
