import { ref } from 'vue';
import { useRoute, useRouter } from 'vue-router';
import { useFieldErrors } from './useFieldErrors';

/**
 * Submitting a sign-in or register form: busy state, field errors from the API, and the redirect
 * to where the user was going.
 */
export function useAuthForm<K extends string>(submit: () => Promise<void>) {
  const router = useRouter();
  const route = useRoute();
  const errors = useFieldErrors<K>();
  const busy = ref(false);

  async function onSubmit(): Promise<void> {
    if (busy.value) return;
    busy.value = true;
    errors.clear();
    try {
      await submit();
      // Only a path on this site: '//host' would leave it.
      const next = typeof route.query.next === 'string' && route.query.next.startsWith('/') && !route.query.next.startsWith('//') ? route.query.next : '/';
      await router.push(next);
    } catch (error) {
      if (!errors.take(error)) throw error;
    } finally {
      busy.value = false;
    }
  }

  return { errors, busy, onSubmit };
}
