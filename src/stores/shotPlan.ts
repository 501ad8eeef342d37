import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { ShotCardFormat, ShotPlan, ShotPlanRequestBody } from '../../shared/schemas/shot-plan';
import { ApiError } from '@/api/client';
import * as shotPlanApi from '@/api/shot-plan';
import type { ShotCardFile } from '@/api/shot-plan';

function isAbort(error: unknown): boolean {
  return (error as { name?: string } | null)?.name === 'AbortError';
}

/**
 * The shot plan of the sightline page's Shot plan tab: the last request, the plan the server
 * computed for it, and how it went. A new request cancels the one before it.
 */
export const useShotPlanStore = defineStore('shotPlan', () => {
  const sightlineId = ref<string | null>(null);
  const body = ref<ShotPlanRequestBody | null>(null);
  const plan = ref<ShotPlan | null>(null);
  const running = ref(false);
  const error = ref('');
  /** Per-field messages from the server (dotted paths such as `lineup.end`). */
  const fields = ref<Record<string, string>>({});
  let controller: AbortController | null = null;

  /** Asks the server for the plan of a lineup. */
  async function run(id: string, request: ShotPlanRequestBody): Promise<void> {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    if (sightlineId.value !== id) plan.value = null;
    sightlineId.value = id;
    body.value = request;
    running.value = true;
    error.value = '';
    fields.value = {};
    try {
      const result = await shotPlanApi.getShotPlan(id, request, mine.signal);
      if (controller !== mine) return;
      plan.value = result;
    } catch (e) {
      if (controller !== mine || isAbort(e)) return;
      error.value = (e as Error).message;
      fields.value = e instanceof ApiError ? e.fields : {};
    } finally {
      if (controller === mine) {
        controller = null;
        running.value = false;
      }
    }
  }

  /** The shot card of the last request, as HTML or PDF. */
  async function card(format: ShotCardFormat): Promise<ShotCardFile> {
    if (!sightlineId.value || !body.value) throw new Error('Make a plan first');
    return shotPlanApi.getShotCard(sightlineId.value, body.value, format);
  }

  /** Forgets everything (another sightline is opened). */
  function reset(): void {
    controller?.abort();
    controller = null;
    sightlineId.value = null;
    body.value = null;
    plan.value = null;
    running.value = false;
    error.value = '';
    fields.value = {};
  }

  return { sightlineId, body, plan, running, error, fields, run, card, reset };
});
