import { createStore } from 'idb-keyval';
import { createOutbox, drainOutbox, idbOutboxStore, type OutboxEntry, type StorageLike } from './outbox';
import { sendQueuedPunch } from './api/create-punch';

/** A punch the server refused: shown until someone taps it away. */
export interface PunchNotice {
  id: string;
  technicianId: number;
  technicianName: string;
  label: string;
  message: string;
}

/** A punch the server took, kept as an overlay until my-day has been fetched again. */
export interface ConfirmedPunch {
  entry: OutboxEntry;
  confirmedAt: number;
}

/** Where a tablet kept its queue before IndexedDB, if the browser lets us read it. */
function legacyStorage(): StorageLike | null {
  try {
    return localStorage;
  } catch {
    return null;
  }
}

export const outbox = createOutbox(idbOutboxStore(createStore('baytime-kiosk', 'outbox')), legacyStorage());

/** Tells other tabs of this kiosk that the queue changed, so they read it again. */
const otherTabs =
  typeof BroadcastChannel === 'function' ? new BroadcastChannel('baytime-kiosk-outbox') : null;
export function tellOtherTabs(): void {
  void outbox.flushed().then(() => otherTabs?.postMessage('changed'));
}

let notices: readonly PunchNotice[] = [];
let confirmed: readonly ConfirmedPunch[] = [];
const listeners = new Set<() => void>();
const emit = () => listeners.forEach((listener) => listener());
const subscribe = (listener: () => void) => {
  listeners.add(listener);
  return () => void listeners.delete(listener);
};

const CONFIRMED_KEEP_MS = 30_000;

export interface PunchQueueHooks {
  onSent?: (entry: OutboxEntry) => void;
  onRefused?: (entry: OutboxEntry) => void;
}

let hooks: PunchQueueHooks = {};
let running: Promise<void> | null = null;
let again = false;
let timer: ReturnType<typeof setTimeout> | undefined;

async function pass() {
  clearTimeout(timer);
  await outbox.ready.catch(() => undefined);
  const result = await drainOutbox(outbox, sendQueuedPunch, {
    now: Date.now,
    onSent(entry) {
      const now = Date.now();
      confirmed = [
        ...confirmed.filter((c) => now - c.confirmedAt < CONFIRMED_KEEP_MS),
        { entry, confirmedAt: now },
      ];
      emit();
      hooks.onSent?.(entry);
    },
    onRefused(entry, message) {
      notices = [
        ...notices,
        {
          id: entry.punch.id,
          technicianId: entry.technicianId,
          technicianName: entry.technicianName,
          label: entry.label,
          message,
        },
      ];
      emit();
      hooks.onRefused?.(entry);
    },
  });
  if (result.sent + result.refused > 0) tellOtherTabs();
  if (result.nextAttemptAt !== null)
    timer = setTimeout(() => void kick(), Math.max(250, result.nextAttemptAt - Date.now()));
}

/** Starts a drain, or asks the running one to look again when it ends. */
export function kick(): Promise<void> {
  if (running) {
    again = true;
    return running;
  }
  running = (async () => {
    try {
      do {
        again = false;
        await pass();
      } while (again);
    } finally {
      running = null;
    }
  })();
  return running;
}

/** Wires the queue to the page once: drains now, when the link returns and when another tab writes. */
export function startPunchQueue(next: PunchQueueHooks): () => void {
  hooks = next;
  const online = () => {
    outbox.retryNow(Date.now());
    void kick();
  };
  const changedElsewhere = () => void outbox.reload().then(kick, () => undefined);
  window.addEventListener('online', online);
  otherTabs?.addEventListener('message', changedElsewhere);
  void kick();
  return () => {
    window.removeEventListener('online', online);
    otherTabs?.removeEventListener('message', changedElsewhere);
    clearTimeout(timer);
    hooks = {};
  };
}

export function dismissNotice(id: string) {
  notices = notices.filter((n) => n.id !== id);
  emit();
}

/** A punch that could not even be queued, e.g. the tablet's storage is full. */
export function pushNotice(notice: PunchNotice) {
  notices = [...notices, notice];
  emit();
}

export const punchQueueStore = {
  subscribe,
  notices: () => notices,
  confirmed: () => confirmed,
};

/** A technician signed in: punches of theirs that waited for a fresh token may go now. */
export function renewQueuedToken(technicianId: number, token: string) {
  outbox.renewToken(technicianId, token, Date.now());
  void kick();
}
