import { delMany, setMany, values, type UseStore } from 'idb-keyval';
import { retryDelayMs, type BreakKind, type PunchKind } from '@baytime/shared';

/**
 * The tablet's durable queue of punches, in IndexedDB: one record per punch, so a long queue costs
 * nothing to add to and a reload reads it back. A tap is written there before anything else, so a
 * punch survives a dropped link, a reload and a sign-out; the queue then drains in order. Each punch
 * id is a UUID and the server answers a replayed id with the stored punch, so sending twice is safe.
 */
export const OUTBOX_KEY = 'baytime.kiosk.outbox';

export interface OutboxPunch {
  id: string;
  kind: PunchKind;
  jobLineId?: number;
  at: string;
  breakKind?: BreakKind;
  /** Recorded offline with badge and PIN sealed to the server's key; sent as this kiosk. */
  sealed?: { keyId: string; identity: string };
}

export interface OutboxEntry {
  punch: OutboxPunch;
  /** The token of the technician who tapped (the kiosk's own for a sealed punch): it drains after they sign out. */
  token: string;
  /** Whose punches go in order together; a sealed punch's is minus its badge number, not yet a person. */
  technicianId: number;
  technicianName: string;
  /** What was tapped, in words, for a refusal message. */
  label: string;
  queuedAt: number;
  /** Order of queueing: one tap's punches go in the order they were made. */
  seq: number;
  attempts: number;
  nextAttemptAt: number;
  lastError: string | null;
  /** The server refused the token (expired): waits until the same technician signs in again. */
  waitingForSignIn: boolean;
}

export type NewOutboxEntry = Pick<
  OutboxEntry,
  'punch' | 'token' | 'technicianId' | 'technicianName' | 'label'
>;

export type SendOutcome =
  | { kind: 'sent' }
  | { kind: 'refused'; message: string }
  | { kind: 'unauthorized'; message: string }
  /** `all`: the link is down, stop the whole pass; `technician`: only this technician's punches wait. */
  | { kind: 'retry'; message: string; scope: 'all' | 'technician' };

/** Where the entries are kept: an IndexedDB object store in the app and in tests (fake-indexeddb). */
export interface OutboxStore {
  all(): Promise<unknown[]>;
  put(entries: readonly OutboxEntry[]): Promise<void>;
  delete(punchIds: readonly string[]): Promise<void>;
}

/** The part of the Web Storage API the old localStorage outbox was kept in, for moving it over. */
export interface StorageLike {
  getItem(key: string): string | null;
  removeItem(key: string): void;
}

export function idbOutboxStore(store: UseStore): OutboxStore {
  return {
    all: () => values(store),
    put: (entries) =>
      setMany(
        entries.map((entry) => [entry.punch.id, entry]),
        store,
      ),
    delete: (punchIds) => delMany([...punchIds], store),
  };
}

export interface Outbox {
  /** Read from the store (and the old localStorage queue moved over): resolves once `list` is true. */
  ready: Promise<void>;
  /** Oldest first. The same array until the outbox changes. */
  list(): readonly OutboxEntry[];
  /**
   * Writes to the store first; rejects when the store refuses, and then nothing was queued. A tap
   * that repeats the technician's previous tap while that one is still queued, being written, or
   * went out less than `REPEAT_TAP_MS` ago is dropped: resolves false.
   */
  add(entries: readonly NewOutboxEntry[], now: number): Promise<boolean>;
  remove(punchId: string): void;
  update(punchId: string, changes: Partial<Omit<OutboxEntry, 'punch'>>): void;
  /** A technician signed in again: their waiting punches get the new token and may go. */
  renewToken(technicianId: number, token: string, now: number): void;
  /** The link came back: every punch may be tried at once. */
  retryNow(now: number): void;
  /** Another tab changed the store: read it again. */
  reload(): Promise<void>;
  /** Resolves once every change so far is in the store. */
  flushed(): Promise<void>;
  subscribe(listener: () => void): () => void;
}

function isEntry(value: unknown): value is OutboxEntry {
  if (typeof value !== 'object' || value === null) return false;
  const entry = value as Partial<OutboxEntry>;
  return (
    typeof entry.punch?.id === 'string' &&
    typeof entry.punch.kind === 'string' &&
    typeof entry.punch.at === 'string' &&
    typeof entry.token === 'string' &&
    typeof entry.technicianId === 'number'
  );
}

/** An entry as stored, with defaults for fields an older tablet did not write. */
function normalise(entry: OutboxEntry, index: number): OutboxEntry {
  return {
    ...entry,
    attempts: entry.attempts ?? 0,
    nextAttemptAt: entry.nextAttemptAt ?? 0,
    lastError: entry.lastError ?? null,
    waitingForSignIn: entry.waitingForSignIn ?? false,
    label: entry.label ?? entry.punch.kind,
    technicianName: entry.technicianName ?? '',
    queuedAt: entry.queuedAt ?? 0,
    seq: entry.seq ?? index,
  };
}

/** The queue a tablet kept in localStorage before the outbox moved to IndexedDB. */
function legacyEntries(storage: StorageLike | null, key: string): OutboxEntry[] {
  if (!storage) return [];
  try {
    const parsed: unknown = JSON.parse(storage.getItem(key) ?? '[]');
    return Array.isArray(parsed) ? parsed.filter(isEntry).map(normalise) : [];
  } catch {
    return [];
  }
}

/** A double tap's second tap comes well inside this; a deliberate repeat after it reaches the server. */
export const REPEAT_TAP_MS = 2_000;

/** What a tap asks for, without its ids and times: two taps of the same button give the same. */
const tapSignature = (entries: readonly NewOutboxEntry[]) =>
  entries
    .map(
      ({ punch }) =>
        `${punch.kind}/${punch.jobLineId ?? ''}/${punch.breakKind ?? ''}/${punch.sealed ? 'sealed' : ''}`,
    )
    .join(',');

export function createOutbox(
  store: OutboxStore,
  legacy: StorageLike | null = null,
  legacyKey: string = OUTBOX_KEY,
): Outbox {
  const listeners = new Set<() => void>();
  let cache: readonly OutboxEntry[] = [];
  let nextSeq = 0;
  // Each technician's last tap, taken before its write so a bounce during the write is seen.
  const lastTap = new Map<number, { signature: string; ids: readonly string[]; at: number }>();
  // Writes reach the store one after another, in the order they were made.
  let writing: Promise<void> = Promise.resolve();
  const persist = (write: () => Promise<void>) => {
    const done = writing.then(write);
    writing = done.catch(() => undefined);
    return done;
  };

  function set(next: readonly OutboxEntry[]) {
    cache = next;
    for (const listener of listeners) listener();
  }

  async function read(): Promise<void> {
    const stored = (await store.all()).filter(isEntry).map(normalise);
    const moved = legacyEntries(legacy, legacyKey).filter(
      (entry) => !stored.some((s) => s.punch.id === entry.punch.id),
    );
    if (moved.length > 0) {
      // Behind everything already in IndexedDB, in the order the old queue held them.
      const base = stored.reduce((max, entry) => Math.max(max, entry.seq + 1), 0);
      moved.forEach((entry, index) => (entry.seq = base + index));
      await store.put(moved);
    }
    // Only once the punches are safe in IndexedDB does the old copy go.
    if (legacy?.getItem(legacyKey) != null) legacy.removeItem(legacyKey);
    const all = [...stored, ...moved].sort((a, b) => a.seq - b.seq);
    nextSeq = all.reduce((max, entry) => Math.max(max, entry.seq + 1), nextSeq);
    set(all);
  }

  function change(fn: (entry: OutboxEntry) => OutboxEntry) {
    const changed: OutboxEntry[] = [];
    const next = cache.map((entry) => {
      const after = fn(entry);
      if (after !== entry) changed.push(after);
      return after;
    });
    if (changed.length === 0) return;
    set(next);
    // A lost write only means a retry sooner or a punch sent again: the server finds it by id.
    void persist(() => store.put(changed)).catch(() => undefined);
  }

  const ready = read();

  return {
    ready,
    list: () => cache,
    async add(entries, now) {
      const technicianId = entries[0]?.technicianId;
      const tap =
        technicianId === undefined
          ? null
          : { signature: tapSignature(entries), ids: entries.map((e) => e.punch.id), at: now };
      if (tap && technicianId !== undefined) {
        const last = lastTap.get(technicianId);
        const lastQueued = last?.ids.some((id) => cache.some((entry) => entry.punch.id === id)) ?? false;
        if (
          last &&
          last.signature === tap.signature &&
          !last.ids.includes(tap.ids[0]!) &&
          (lastQueued || now - last.at < REPEAT_TAP_MS)
        )
          return false;
        lastTap.set(technicianId, tap);
      }
      await ready;
      const known = new Set(cache.map((entry) => entry.punch.id));
      const fresh = entries
        .filter((entry) => !known.has(entry.punch.id))
        .map<OutboxEntry>((entry) => ({
          ...entry,
          queuedAt: now,
          seq: nextSeq++,
          attempts: 0,
          nextAttemptAt: now,
          lastError: null,
          waitingForSignIn: false,
        }));
      if (fresh.length === 0) return true;
      try {
        await persist(() => store.put(fresh));
      } catch (error) {
        // Nothing was queued: the same tap again is a retry, not a repeat.
        if (tap && technicianId !== undefined && lastTap.get(technicianId) === tap)
          lastTap.delete(technicianId);
        throw error;
      }
      set([...cache, ...fresh]);
      return true;
    },
    remove(punchId) {
      const next = cache.filter((entry) => entry.punch.id !== punchId);
      if (next.length === cache.length) return;
      set(next);
      void persist(() => store.delete([punchId])).catch(() => undefined);
    },
    update(punchId, changes) {
      change((entry) => (entry.punch.id === punchId ? { ...entry, ...changes } : entry));
    },
    renewToken(technicianId, token, now) {
      change((entry) =>
        entry.technicianId === technicianId && (entry.token !== token || entry.waitingForSignIn)
          ? { ...entry, token, waitingForSignIn: false, nextAttemptAt: now }
          : entry,
      );
    },
    retryNow(now) {
      change((entry) => (entry.nextAttemptAt > now ? { ...entry, nextAttemptAt: now } : entry));
    },
    async reload() {
      await writing;
      await read();
    },
    flushed: () => writing,
    subscribe(listener) {
      listeners.add(listener);
      return () => void listeners.delete(listener);
    },
  };
}

/** How a failed send is treated, from the HTTP status (0 = no answer at all). */
export function classifyFailure(status: number, message: string): SendOutcome {
  if (status === 0) return { kind: 'retry', scope: 'all', message };
  if (status === 401) return { kind: 'unauthorized', message };
  if (status === 408 || status === 429 || status >= 500)
    return { kind: 'retry', scope: 'technician', message };
  return { kind: 'refused', message };
}

const PUNCH_RETRY = { firstMs: 1_000, maxMs: 60_000 };

/**
 * The shared back-off (1 s doubling to a minute) with ±20 % jitter, so tablets that lost the link
 * together don't retry together; `random` is injectable so the outbox's tests are exact.
 */
export function backoffMs(attempts: number, random: () => number = Math.random): number {
  return Math.round(retryDelayMs(attempts, PUNCH_RETRY) * (0.8 + 0.4 * random()));
}

export interface DrainOptions {
  now: () => number;
  random?: () => number;
  onSent?: (entry: OutboxEntry) => void;
  onRefused?: (entry: OutboxEntry, message: string) => void;
}

export interface DrainResult {
  sent: number;
  refused: number;
  /** When the next try is due, if some punch is waiting for a backoff; null if none. */
  nextAttemptAt: number | null;
}

/**
 * Sends what is due, oldest first. One technician's punches always go in the order they were
 * tapped: when one of them has to wait, the ones after it wait too. Other technicians' punches
 * are independent of it and still go, unless the link itself is down.
 */
export async function drainOutbox(
  outbox: Outbox,
  send: (entry: OutboxEntry) => Promise<SendOutcome>,
  { now, random = Math.random, onSent, onRefused }: DrainOptions,
): Promise<DrainResult> {
  const result: DrainResult = { sent: 0, refused: 0, nextAttemptAt: null };
  const held = new Set<number>();
  const seen = new Set<string>();
  const waitUntil = (at: number) => {
    result.nextAttemptAt = result.nextAttemptAt === null ? at : Math.min(result.nextAttemptAt, at);
  };

  for (;;) {
    const entry = outbox.list().find((e) => !seen.has(e.punch.id) && !held.has(e.technicianId));
    if (!entry) break;
    seen.add(entry.punch.id);

    if (entry.waitingForSignIn) {
      held.add(entry.technicianId);
      continue;
    }
    if (entry.nextAttemptAt > now()) {
      held.add(entry.technicianId);
      waitUntil(entry.nextAttemptAt);
      continue;
    }

    let outcome: SendOutcome;
    try {
      outcome = await send(entry);
    } catch (error) {
      outcome = {
        kind: 'retry',
        scope: 'all',
        message: error instanceof Error ? error.message : String(error),
      };
    }

    switch (outcome.kind) {
      case 'sent':
        outbox.remove(entry.punch.id);
        result.sent += 1;
        onSent?.(entry);
        break;
      case 'refused':
        outbox.remove(entry.punch.id);
        result.refused += 1;
        onRefused?.(entry, outcome.message);
        break;
      case 'unauthorized':
        outbox.update(entry.punch.id, { waitingForSignIn: true, lastError: outcome.message });
        held.add(entry.technicianId);
        break;
      case 'retry': {
        const attempts = entry.attempts + 1;
        const nextAttemptAt = now() + backoffMs(attempts, random);
        outbox.update(entry.punch.id, { attempts, nextAttemptAt, lastError: outcome.message });
        waitUntil(nextAttemptAt);
        if (outcome.scope === 'all') {
          // The other punches would only fail the same way: they wait for the same moment.
          for (const other of outbox.list())
            if (other.nextAttemptAt < nextAttemptAt && !other.waitingForSignIn)
              outbox.update(other.punch.id, { nextAttemptAt });
          return result;
        }
        held.add(entry.technicianId);
        break;
      }
    }
  }
  return result;
}
