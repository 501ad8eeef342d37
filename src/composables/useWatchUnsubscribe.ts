import { computed, ref, watch } from 'vue';
import { useRoute } from 'vue-router';
import { unsubscribeRequestSchema, type UnsubscribeState } from '../../shared/schemas/watch';
import { ApiError } from '@/api/client';
import { useSessionStore } from '@/stores/session';
import { useWatchesStore } from '@/stores/watches';

/**
 * The pause link of a watch's e-mail (works signed out): reads ?token, shows which watch it
 * pauses, pauses it once. Phases: loading, ready (may pause), paused (just done), used (the link
 * was used before), error (bad or missing token, watch gone: the server's message).
 */
export function useWatchUnsubscribe() {
  const route = useRoute();
  const store = useWatchesStore();
  const session = useSessionStore();

  const phase = ref<'loading' | 'ready' | 'paused' | 'used' | 'error'>('loading');
  const state = ref<UnsubscribeState | null>(null);
  const problem = ref('');
  const busy = ref(false);

  const token = computed(() => (typeof route.query.token === 'string' ? route.query.token : ''));

  /** The message of a failed call: the token's own field message if the server gave one. */
  function messageOf(error: unknown): string {
    if (error instanceof ApiError) return error.fields.token ?? error.message;
    return (error as Error).message;
  }

  function checkedToken(): string | null {
    const parsed = unsubscribeRequestSchema.safeParse({ token: token.value });
    if (parsed.success) return parsed.data.token;
    phase.value = 'error';
    problem.value = parsed.error.issues[0]?.message ?? 'This link is not complete';
    return null;
  }

  async function load(): Promise<void> {
    const t = checkedToken();
    if (!t) return;
    phase.value = 'loading';
    problem.value = '';
    try {
      state.value = await store.unsubscribeState(t);
      phase.value = state.value.used ? 'used' : 'ready';
    } catch (error) {
      phase.value = 'error';
      problem.value = messageOf(error);
    }
  }

  async function pause(): Promise<void> {
    const t = checkedToken();
    if (!t || busy.value) return;
    busy.value = true;
    try {
      state.value = await store.unsubscribe(t);
      phase.value = 'paused';
    } catch (error) {
      if (error instanceof ApiError && error.code === 'conflict') {
        phase.value = 'used';
        problem.value = error.message;
      } else {
        phase.value = 'error';
        problem.value = messageOf(error);
      }
    } finally {
      busy.value = false;
    }
  }

  watch(token, () => { void load(); }, { immediate: true });

  const usedOn = computed(() => state.value?.usedAt?.slice(0, 10) ?? '');

  return { phase, state, problem, busy, pause, usedOn, signedIn: computed(() => session.isSignedIn) };
}
