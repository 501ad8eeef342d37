import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { Sightline, SightlineInputBody } from '../../shared/schemas/sightline';
import * as sightlinesApi from '@/api/sightlines';
import type { SightlineChange } from '@/api/sightlines';

/** The signed-in user's saved sightlines. */
export const useSightlinesStore = defineStore('sightlines', () => {
  const sightlines = ref<Sightline[]>([]);
  const loading = ref(false);
  /** True once the list came back at least once. */
  const loaded = ref(false);

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

  return { sightlines, loading, loaded, refresh, get, create, update, remove };
});
