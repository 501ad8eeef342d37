import { computed, onMounted, ref } from 'vue';
import { useDialog, useMessage } from 'naive-ui';
import { formatLocalTime } from '../../shared/sky';
import { useWatchesStore } from '@/stores/watches';
import { browserZone } from './useLineupTime';

/** The browser's own zone, for times that belong to no site. */

/**
 * The secret calendar feed of the signed-in user: its address to copy into a calendar app, and
 * "make a new address" (the old one stops working) after a confirmation.
 */
export function useCalendarFeed() {
  const store = useWatchesStore();
  const dialog = useDialog();
  const message = useMessage();
  const rotating = ref(false);
  /** The read-only input, selected when the clipboard cannot be written. */
  const input = ref<{ select: () => void } | null>(null);

  onMounted(() => { if (!store.feed) void store.loadFeed(); });

  const url = computed(() => store.feed?.url ?? '');
  const since = computed(() => (store.feed ? formatLocalTime(new Date(store.feed.createdAt), browserZone()) : ''));

  async function copy(): Promise<void> {
    if (!url.value) return;
    try {
      // The clipboard needs a secure context (https or localhost); elsewhere the text is selected instead.
      if (!navigator.clipboard) throw new Error('no clipboard');
      await navigator.clipboard.writeText(url.value);
      message.success('Address copied');
    } catch {
      input.value?.select();
      message.info('Selected: press Ctrl+C (⌘C) to copy');
    }
  }

  function confirmRotate(): void {
    dialog.warning({
      title: 'Make a new address?',
      content: 'The old address stops working at once: calendars subscribed to it stop showing your lineups until you give them the new one.',
      positiveText: 'Make a new address',
      negativeText: 'Keep the old one',
      // Attributes fall through to the button element, for browser tests.
      positiveButtonProps: { 'data-testid': 'calendar-feed-rotate-confirm' } as never,
      onPositiveClick: async () => {
        rotating.value = true;
        try {
          await store.rotateFeed();
          message.success('New address made; the old one no longer works');
          return true;
        } catch (error) {
          message.error((error as Error).message);
          return false;
        } finally {
          rotating.value = false;
        }
      },
    });
  }

  return { store, url, since, input, rotating, copy, confirmRotate };
}
