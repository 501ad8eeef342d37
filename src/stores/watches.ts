import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import type { CalendarFeed, UnsubscribeState, Watch, WatchDelivery, WatchInputBody, WatchUpdateBody } from '../../shared/schemas/watch';
import * as watchesApi from '@/api/watches';
import * as calendarApi from '@/api/calendar';

/** The e-mails of one watch, loaded on demand. */
export interface DeliveryList {
  items: WatchDelivery[];
  loading: boolean;
  error: string;
}

function newestFirst(a: Watch, b: Watch): number {
  return b.createdAt.localeCompare(a.createdAt) || a.id.localeCompare(b.id);
}

/**
 * The signed-in user's watches (one list, whether loaded whole for the Watches page or one
 * sightline's at a time for its Watch tab), their e-mails, the secret calendar feed, and the
 * pause link of an e-mail (which works signed out).
 */
export const useWatchesStore = defineStore('watches', () => {
  const byId = ref<Record<string, Watch>>({});
  const loading = ref(false);
  const loadError = ref('');
  /** True once the whole list came back at least once. */
  const loaded = ref(false);
  /** The sightline whose watches are loading for its Watch tab. */
  const sightlineLoading = ref<string | null>(null);
  const sightlineError = ref('');
  const deliveries = ref<Record<string, DeliveryList>>({});

  const feed = ref<CalendarFeed | null>(null);
  const feedLoading = ref(false);
  const feedError = ref('');

  const watches = computed(() => Object.values(byId.value).sort(newestFirst));

  /** The watches of one sightline, newest first. */
  function ofSightline(sightlineId: string): Watch[] {
    return watches.value.filter((w) => w.sightlineId === sightlineId);
  }

  function put(watch: Watch): void {
    byId.value = { ...byId.value, [watch.id]: watch };
  }

  /** Loads all the user's watches. */
  async function refresh(): Promise<void> {
    loading.value = true;
    loadError.value = '';
    try {
      const list = await watchesApi.listWatches();
      byId.value = Object.fromEntries(list.map((w) => [w.id, w]));
      loaded.value = true;
    } catch (error) {
      loadError.value = (error as Error).message;
    } finally {
      loading.value = false;
    }
  }

  /** Loads one sightline's watches, replacing what the store held for it. */
  async function loadForSightline(sightlineId: string): Promise<void> {
    sightlineLoading.value = sightlineId;
    sightlineError.value = '';
    try {
      const list = await watchesApi.listWatches({ sightlineId });
      const others = Object.values(byId.value).filter((w) => w.sightlineId !== sightlineId);
      byId.value = Object.fromEntries([...others, ...list].map((w) => [w.id, w]));
    } catch (error) {
      if (sightlineLoading.value === sightlineId) sightlineError.value = (error as Error).message;
    } finally {
      if (sightlineLoading.value === sightlineId) sightlineLoading.value = null;
    }
  }

  async function create(input: WatchInputBody): Promise<Watch> {
    const watch = await watchesApi.createWatch(input);
    put(watch);
    return watch;
  }

  async function update(id: string, change: WatchUpdateBody): Promise<Watch> {
    const watch = await watchesApi.updateWatch(id, change);
    put(watch);
    return watch;
  }

  async function setPaused(id: string, paused: boolean): Promise<Watch> {
    return update(id, { paused });
  }

  async function remove(id: string): Promise<void> {
    await watchesApi.deleteWatch(id);
    const { [id]: _gone, ...rest } = byId.value;
    byId.value = rest;
    const { [id]: _list, ...otherDeliveries } = deliveries.value;
    deliveries.value = otherDeliveries;
  }

  /** Loads (again) the e-mails of a watch into `deliveries[id]`. */
  async function loadDeliveries(id: string): Promise<void> {
    const current = deliveries.value[id];
    deliveries.value = { ...deliveries.value, [id]: { items: current?.items ?? [], loading: true, error: '' } };
    try {
      const items = await watchesApi.listDeliveries(id);
      deliveries.value = { ...deliveries.value, [id]: { items, loading: false, error: '' } };
    } catch (error) {
      deliveries.value = { ...deliveries.value, [id]: { items: current?.items ?? [], loading: false, error: (error as Error).message } };
    }
  }

  async function loadFeed(): Promise<void> {
    feedLoading.value = true;
    feedError.value = '';
    try {
      feed.value = await calendarApi.getCalendarFeed();
    } catch (error) {
      feedError.value = (error as Error).message;
    } finally {
      feedLoading.value = false;
    }
  }

  /** A new secret feed address; the old one stops working. */
  async function rotateFeed(): Promise<CalendarFeed> {
    feed.value = await calendarApi.rotateCalendarFeed();
    feedError.value = '';
    return feed.value;
  }

  /** What an e-mail's pause link would do. */
  function unsubscribeState(token: string): Promise<UnsubscribeState> {
    return watchesApi.getUnsubscribeState(token);
  }

  /** Uses an e-mail's pause link (once); the watch, if loaded, shows as paused. */
  async function unsubscribe(token: string): Promise<UnsubscribeState> {
    const state = await watchesApi.pauseWithToken(token);
    const held = byId.value[state.watch.id];
    if (held) put({ ...held, paused: state.watch.paused });
    return state;
  }

  /** Forgets everything (on sign-out). */
  function reset(): void {
    byId.value = {};
    deliveries.value = {};
    loaded.value = false;
    feed.value = null;
  }

  return {
    watches, loading, loadError, loaded, sightlineLoading, sightlineError, deliveries, feed, feedLoading, feedError,
    ofSightline, refresh, loadForSightline, create, update, setPaused, remove, loadDeliveries,
    loadFeed, rotateFeed, unsubscribeState, unsubscribe, reset,
  };
});
