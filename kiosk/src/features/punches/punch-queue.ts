import { OUTBOX_KEY, createOutbox, drainOutbox, type OutboxEntry, type StorageLike } from './outbox';
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

const memoryStorage = (): StorageLike => {
  const data = new Map<string, string>();
  return {
    getItem: (key) => data.get(key) ?? null,
    setItem: (key, value) => void data.set(key, value),
    removeItem: (key) => void data.delete(key),
  };
};

function pickStorage(): StorageLike {
  try {
    const probe = '__baytime_probe__';
    localStorage.setItem(probe, probe);
    localStorage.removeItem(probe);
    return localStorage;
  } catch {
    return memoryStorage();
  }
}

export const outbox = createOutbox(pickStorage());

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
  const storage = (event: StorageEvent) => {
    if (event.key === null || event.key === OUTBOX_KEY) {
      outbox.reload();
      void kick();
    }
  };
  window.addEventListener('online', online);
  window.addEventListener('storage', storage);
  void kick();
  return () => {
    window.removeEventListener('online', online);
    window.removeEventListener('storage', storage);
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
