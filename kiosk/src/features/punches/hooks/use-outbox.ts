import { useSyncExternalStore } from 'react';
import { outbox, punchQueueStore } from '../punch-queue';

export const useOutboxEntries = () => useSyncExternalStore(outbox.subscribe, outbox.list);
export const usePunchNotices = () => useSyncExternalStore(punchQueueStore.subscribe, punchQueueStore.notices);
export const useConfirmedPunches = () =>
  useSyncExternalStore(punchQueueStore.subscribe, punchQueueStore.confirmed);
