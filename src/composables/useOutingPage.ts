import { computed, ref, watch } from 'vue';
import { useRoute } from 'vue-router';
import { useMessage } from 'naive-ui';
import { DateTime } from 'luxon';
import { roleAllows } from '../../shared/policy/sightline-policy';
import { formatDms } from '../../shared/geo';
import type { OutingAnswer } from '../../shared/schemas/outing';
import { useOutingStore } from '@/stores/outing';
import { useSessionStore } from '@/stores/session';
import { useSightlineDetailPage } from './useSightlineDetailPage';
import { clockOf, nightLabel } from './useLineupTime';

export const ANSWER_LABELS: Record<OutingAnswer, string> = { going: 'Going', maybe: 'Maybe', 'not-going': 'Not going' };

/**
 * The outing page: the outing with the crew's answers, the person's own answer, and the sightline
 * page's state (its night chart set to the outing's night, the lineups with their tide status).
 */
export function useOutingPage() {
  const route = useRoute();
  const store = useOutingStore();
  const session = useSessionStore();
  const message = useMessage();
  const page = useSightlineDetailPage();
  const answering = ref<OutingAnswer | null>(null);
  const note = ref('');

  const outingId = computed(() => String(route.params.outingId ?? ''));
  watch(outingId, (id) => { if (id) void store.open(id); }, { immediate: true });

  const outing = computed(() => store.outing);
  // The night chart shows the outing's night.
  watch(() => store.outing?.night, (night) => { if (night) page.lineups.selectedNight = night; }, { immediate: true });

  const me = computed(() => outing.value?.people.find((p) => p.userId === session.user?.id) ?? null);
  watch(me, (m) => { if (m) note.value = m.note; }, { immediate: true });
  const canAnswer = computed(() => roleAllows(page.detail.sightline?.myRole ?? 'outsider', 'answer-outing'));

  const zone = computed(() => outing.value?.timezone ?? 'UTC');
  const heading = computed(() => (outing.value ? nightLabel(outing.value.night) : ''));
  const meetingText = computed(() => {
    const o = outing.value;
    if (!o) return '';
    return DateTime.fromISO(o.meetingAt, { zone: o.timezone }).toFormat("ccc d LLL yyyy, HH:mm ZZZZ");
  });
  const lineupText = computed(() => {
    const l = outing.value?.lineup;
    return l ? `${clockOf(l.start, zone.value)}–${clockOf(l.end, zone.value)}, peak ${clockOf(l.peak, zone.value)}` : '';
  });
  const meetingPointText = computed(() => (outing.value ? formatDms(outing.value.meetingPoint) : ''));
  /** The lineups of the outing's night from the sightline's search (they carry the tide status). */
  const nightLineups = computed(() => {
    const o = outing.value;
    const result = page.lineups.search.result;
    if (!o || !result) return [];
    return result.lineups.filter((l) => DateTime.fromISO(l.start, { zone: o.timezone }).minus({ hours: 12 }).toISODate() === o.night);
  });
  const counts = computed(() => {
    const people = outing.value?.people ?? [];
    return {
      going: people.filter((p) => p.answer === 'going').length,
      maybe: people.filter((p) => p.answer === 'maybe').length,
      notGoing: people.filter((p) => p.answer === 'not-going').length,
      noAnswer: people.filter((p) => p.answer === null).length,
    };
  });

  async function answer(value: OutingAnswer): Promise<void> {
    answering.value = value;
    try {
      await store.answer(value, note.value.trim());
      message.success(`Answered: ${ANSWER_LABELS[value].toLowerCase()}`);
    } catch (error) {
      message.error((error as Error).message);
    } finally {
      answering.value = null;
    }
  }

  return { page, store, outing, me, canAnswer, answering, note, heading, meetingText, meetingPointText, lineupText, nightLineups, counts, answer };
}
