import { computed, ref, watch } from 'vue';
import { useRoute, useRouter } from 'vue-router';
import type { InviteLookup } from '../../shared/schemas/crew';
import { acceptInvite, lookupInvite } from '@/api/crew';
import { useSessionStore } from '@/stores/session';

/**
 * The page an invite link opens: what the invite offers, then sign in or register with the
 * invited address, and accept; a signed-in person with that address accepts at once and lands on
 * the sightline.
 */
export function useInviteAccept() {
  const route = useRoute();
  const router = useRouter();
  const session = useSessionStore();
  const invite = ref<InviteLookup | null>(null);
  const error = ref('');
  const loading = ref(true);
  const accepting = ref(false);

  const token = computed(() => (typeof route.query.token === 'string' ? route.query.token : ''));
  /** Where sign-in and registration come back to. */
  const back = computed(() => route.fullPath);
  const signedInAs = computed(() => session.user?.email ?? null);
  const addressMatches = computed(() => !!invite.value && signedInAs.value?.toLowerCase() === invite.value.email);

  async function accept(): Promise<void> {
    accepting.value = true;
    error.value = '';
    try {
      const { sightlineId } = await acceptInvite(token.value);
      await router.replace({ name: 'sightline', params: { id: sightlineId } });
    } catch (e) {
      error.value = (e as Error).message;
    } finally {
      accepting.value = false;
    }
  }

  watch(token, async (t) => {
    loading.value = true;
    error.value = '';
    invite.value = null;
    if (!t) {
      error.value = 'This link has no invite in it. Copy the whole link from the e-mail.';
      loading.value = false;
      return;
    }
    try {
      await session.load().catch(() => undefined);
      invite.value = await lookupInvite(t);
      if (invite.value.status === 'pending' && addressMatches.value) await accept();
    } catch (e) {
      error.value = (e as Error).message;
    } finally {
      loading.value = false;
    }
  }, { immediate: true });

  return { invite, error, loading, accepting, token, back, signedInAs, addressMatches, accept };
}
