import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { OutboxMessage, OutboxSummary } from '../../shared/schemas/outbox';
import * as outboxApi from '@/api/outbox';

/** Default rows per page of the outbox list. */
export const OUTBOX_PAGE_SIZE = 20;

/** The admin's outbox: one page of what the local mail catcher received, and one message opened. */
export const useOutboxStore = defineStore('outbox', () => {
  const messages = ref<OutboxSummary[]>([]);
  const total = ref(0);
  const page = ref(1);
  const pageSize = ref(OUTBOX_PAGE_SIZE);
  const loading = ref(false);
  const loadError = ref('');

  const selected = ref<OutboxMessage | null>(null);
  const selectedId = ref<string | null>(null);
  const messageLoading = ref(false);
  const messageError = ref('');
  let listToken = 0;

  /** Loads a page (default: the current one). */
  async function load(nextPage = page.value, nextPageSize = pageSize.value): Promise<void> {
    const token = ++listToken;
    loading.value = true;
    loadError.value = '';
    try {
      const answer = await outboxApi.listOutbox({ page: nextPage, pageSize: nextPageSize });
      if (token !== listToken) return;
      messages.value = answer.messages;
      total.value = answer.total;
      page.value = answer.page;
      pageSize.value = answer.pageSize;
    } catch (error) {
      if (token === listToken) loadError.value = (error as Error).message;
    } finally {
      if (token === listToken) loading.value = false;
    }
  }

  /** Opens one message. */
  async function open(id: string): Promise<void> {
    selectedId.value = id;
    if (selected.value?.id !== id) selected.value = null;
    messageLoading.value = true;
    messageError.value = '';
    try {
      const message = await outboxApi.getOutboxMessage(id);
      if (selectedId.value === id) selected.value = message;
    } catch (error) {
      if (selectedId.value === id) messageError.value = (error as Error).message;
    } finally {
      if (selectedId.value === id) messageLoading.value = false;
    }
  }

  function close(): void {
    selectedId.value = null;
    selected.value = null;
    messageError.value = '';
  }

  /** Address of a message as received (.eml). */
  function rawUrl(id: string): string {
    return outboxApi.outboxRawUrl(id);
  }

  return { messages, total, page, pageSize, loading, loadError, selected, selectedId, messageLoading, messageError, load, open, close, rawUrl };
});
