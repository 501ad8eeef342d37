import { computed, onBeforeUnmount, onMounted, watch } from 'vue';
import type { Lineup, TargetRef } from '../../shared/schemas/lineup';
import type { ShotPlanRequestBody } from '../../shared/schemas/shot-plan';
import { useGearStore } from '@/stores/gear';
import { useShotPlanStore } from '@/stores/shotPlan';
import { shotPlanFieldOfPath, useShotPlanForm, type ShotPlanFormField } from './useShotPlanForm';
import { useSightlinePageContext } from './useSightlineDetailPage';

/** Wait after the last change before the plan is asked for again, ms. */
const REPLAN_DELAY_MS = 350;

/**
 * The Shot plan tab of the sightline page: the user's gear, the page's lineups, the form, and the
 * plan from the server, asked for again shortly after each change of the form.
 */
export function useShotPlanPanel() {
  const page = useSightlinePageContext();
  const gear = useGearStore();
  const store = useShotPlanStore();

  const lineups = computed<Lineup[]>(() => page.lineups.search.result?.lineups ?? []);
  const target = computed<TargetRef | null>(() => {
    const t = page.lineups.search.result?.target;
    if (!t) return null;
    return t.id ? { id: t.id } : { name: t.name, raHours: t.raHours, decDeg: t.decDeg };
  });
  const timeZone = computed(() => page.detail.timeZone);
  const plan = computed(() => (store.sightlineId === page.id.value ? store.plan : null));

  const shotForm = useShotPlanForm({
    lineups,
    bodies: computed(() => gear.bodies),
    lenses: computed(() => gear.lenses),
    starTrackerAvailable: computed(() => gear.settings.starTrackerAvailable),
    timeZone,
    target,
  });

  /** Messages by form field: the form's own check first, then the server's. */
  const fields = computed<Partial<Record<ShotPlanFormField, string>>>(() => {
    const out: Partial<Record<ShotPlanFormField, string>> = { ...shotForm.checked.value.fields };
    for (const [path, message] of Object.entries(store.fields)) {
      const key = shotPlanFieldOfPath(path);
      if (key && !out[key]) out[key] = message;
    }
    return out;
  });
  function feedback(key: ShotPlanFormField): { validationStatus?: 'error'; feedback?: string } {
    const message = fields.value[key];
    return message ? { validationStatus: 'error', feedback: message } : {};
  }
  /** A server message that belongs to no field of the form. */
  const generalError = computed(() => {
    if (!store.error) return '';
    const placed = Object.keys(store.fields).some((p) => shotPlanFieldOfPath(p) !== null);
    return placed ? '' : store.error;
  });

  let timer: ReturnType<typeof setTimeout> | undefined;
  function schedule(body: ShotPlanRequestBody | null): void {
    clearTimeout(timer);
    if (!body || !page.id.value) return;
    const id = page.id.value;
    timer = setTimeout(() => { void store.run(id, body); }, REPLAN_DELAY_MS);
  }
  watch(() => shotForm.checked.value.body, (body) => schedule(body), { deep: true });
  watch(() => page.id.value, (id, previous) => { if (id !== previous) store.reset(); });

  onMounted(() => {
    void gear.load();
    schedule(shotForm.checked.value.body);
  });
  onBeforeUnmount(() => clearTimeout(timer));

  /** Runs the plan now (the Try again button). */
  function replan(): void {
    const body = shotForm.checked.value.body;
    if (body && page.id.value) void store.run(page.id.value, body);
  }

  return { page, gear, store, plan, shotForm, feedback, generalError, replan, timeZone };
}
export type ShotPlanPanel = ReturnType<typeof useShotPlanPanel>;
