import { computed, inject, provide, ref, watch, type InjectionKey } from 'vue';
import { useRoute, useRouter } from 'vue-router';
import { useFieldNotesStore } from '@/stores/fieldNotes';
import { useLineupsStore } from '@/stores/lineups';
import { useSightlineDetailStore } from '@/stores/sightlineDetail';
import { zoneHeading } from './useLineupTime';
import { useLineupSearchForm } from './useLineupSearchForm';

/** The tabs of the sightline page. */
export const SIGHTLINE_TABS = ['lineups', 'night', 'year', 'notes', 'tides', 'photos', 'shotplan', 'watch', 'crew'] as const;
export type SightlineTab = (typeof SIGHTLINE_TABS)[number];

const pageKey: InjectionKey<SightlinePage> = Symbol('sightline page');

const NIGHT_RE = /^\d{4}-\d{2}-\d{2}$/;

function createPage() {
  const route = useRoute();
  const router = useRouter();
  const detail = useSightlineDetailStore();
  const notes = useFieldNotesStore();
  const lineups = useLineupsStore();
  const sightline = computed(() => detail.sightline);
  const form = useLineupSearchForm(sightline);
  const searchMessages = ref<string[]>([]);

  const id = computed(() => String(route.params.id ?? ''));
  const tab = computed<SightlineTab>(() => {
    const q = String(route.query.tab ?? '');
    return (SIGHTLINE_TABS as readonly string[]).includes(q) ? (q as SightlineTab) : 'lineups';
  });

  function setTab(next: SightlineTab): void {
    if (next !== tab.value) void router.replace({ query: { ...route.query, tab: next } });
  }

  /** Opens the night chart of a night ('YYYY-MM-DD', site zone). */
  function openNight(date: string): void {
    lineups.selectedNight = date;
    void router.replace({ query: { ...route.query, tab: 'night', night: date } });
  }

  async function runSearch(): Promise<void> {
    searchMessages.value = [];
    const body = form.buildBody();
    if (!body) return;
    await lineups.runSearch(body);
    if (Object.keys(lineups.search.fields).length > 0) searchMessages.value = form.takeServerFields(lineups.search.fields);
  }

  watch(id, async (next, previous) => {
    if (!next) return;
    if (next !== previous) lineups.reset();
    await Promise.all([detail.open(next), notes.load(next)]);
    // The first view answers "when is it next good?" at once: the default search runs on open.
    if (detail.sightline?.id === next && !lineups.search.body) await runSearch();
  }, { immediate: true });

  watch(() => route.query.night, (night) => {
    if (typeof night === 'string' && NIGHT_RE.test(night)) lineups.selectedNight = night;
  }, { immediate: true });

  // Lineups depend on the vantage, and their tide status on the tide rule and tide times: search again when they change.
  watch(() => detail.planRevision, () => { void lineups.refreshAll(); });

  const zoneText = computed(() => (detail.sightline ? zoneHeading(detail.sightline.timezone) : ''));

  return { id, tab, setTab, openNight, runSearch, searchMessages, form, detail, notes, lineups, zoneText };
}
export type SightlinePage = ReturnType<typeof createPage>;

/** The sightline page's state, created once by the view and shared with its sections. */
export function useSightlineDetailPage(): SightlinePage {
  const page = createPage();
  provide(pageKey, page);
  return page;
}

/** The page state in a section of the sightline page. */
export function useSightlinePageContext(): SightlinePage {
  const page = inject(pageKey);
  if (!page) throw new Error('useSightlinePageContext() outside the sightline page');
  return page;
}
