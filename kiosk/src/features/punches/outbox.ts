import { retryDelayMs, type BreakKind, type PunchKind } from '@baytime/shared';

/**
 * The tablet's durable queue of punches. A tap is written here before anything else, so a punch
 * survives a dropped link, a reload and a sign-out; the queue then drains in order. Each punch id
 * is a UUID and the server answers a replayed id with the stored punch, so sending twice is safe.
 */
export const OUTBOX_KEY = 'baytime.kiosk.outbox';

export interface OutboxPunch {
  id: string;
  kind: PunchKind;
  jobLineId?: number;
  at: string;
  breakKind?: BreakKind;
}

export interface OutboxEntry {
  punch: OutboxPunch;
  /** The token of the technician who tapped: the punch drains after they sign out. */
  token: string;
  technicianId: number;
  technicianName: string;
  /** What was tapped, in words, for a refusal message. */
  label: string;
  queuedAt: number;
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

/** The part of the Web Storage API the outbox needs; localStorage in the app, a Map in tests. */
export interface StorageLike {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

export interface Outbox {
  /** Oldest first. The same array until the outbox changes. */
  list(): readonly OutboxEntry[];
  /** Writes to storage first; throws when storage refuses, and then nothing was queued. */
  add(entries: readonly NewOutboxEntry[], now: number): void;
  remove(punchId: string): void;
  update(punchId: string, changes: Partial<Omit<OutboxEntry, 'punch'>>): void;
  /** A technician signed in again: their waiting punches get the new token and may go. */
  renewToken(technicianId: number, token: string, now: number): void;
  /** The link came back: every punch may be tried at once. */
  retryNow(now: number): void;
  /** Storage was changed elsewhere (another tab): read it again. */
  reload(): void;
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

export function createOutbox(storage: StorageLike, key: string = OUTBOX_KEY): Outbox {
  const listeners = new Set<() => void>();
  let cache: readonly OutboxEntry[] | null = null;

  function read(): readonly OutboxEntry[] {
    if (cache) return cache;
    let parsed: unknown;
    try {
      parsed = JSON.parse(storage.getItem(key) ?? '[]');
    } catch {
      parsed = [];
    }
    cache = Array.isArray(parsed)
      ? parsed.filter(isEntry).map((entry) => ({
          ...entry,
          attempts: entry.attempts ?? 0,
          nextAttemptAt: entry.nextAttemptAt ?? 0,
          lastError: entry.lastError ?? null,
          waitingForSignIn: entry.waitingForSignIn ?? false,
          label: entry.label ?? entry.punch.kind,
          technicianName: entry.technicianName ?? '',
          queuedAt: entry.queuedAt ?? 0,
        }))
      : [];
    return cache;
  }

  function write(next: readonly OutboxEntry[]) {
    if (next.length === 0) storage.removeItem(key);
    else storage.setItem(key, JSON.stringify(next));
    cache = next;
    for (const listener of listeners) listener();
  }

  function map(fn: (entry: OutboxEntry) => OutboxEntry) {
    const before = read();
    let changed = false;
    const next = before.map((entry) => {
      const after = fn(entry);
      if (after !== entry) changed = true;
      return after;
    });
    if (changed) write(next);
  }

  return {
    list: read,
    add(entries, now) {
      const known = new Set(read().map((entry) => entry.punch.id));
      const fresh = entries
        .filter((entry) => !known.has(entry.punch.id))
        .map<OutboxEntry>((entry) => ({
          ...entry,
          queuedAt: now,
          attempts: 0,
          nextAttemptAt: now,
          lastError: null,
          waitingForSignIn: false,
        }));
      if (fresh.length > 0) write([...read(), ...fresh]);
    },
    remove(punchId) {
      const before = read();
      const next = before.filter((entry) => entry.punch.id !== punchId);
      if (next.length !== before.length) write(next);
    },
    update(punchId, changes) {
      map((entry) => (entry.punch.id === punchId ? { ...entry, ...changes } : entry));
    },
    renewToken(technicianId, token, now) {
      map((entry) =>
        entry.technicianId === technicianId && (entry.token !== token || entry.waitingForSignIn)
          ? { ...entry, token, waitingForSignIn: false, nextAttemptAt: now }
          : entry,
      );
    },
    retryNow(now) {
      map((entry) => (entry.nextAttemptAt > now ? { ...entry, nextAttemptAt: now } : entry));
    },
    reload() {
      cache = null;
      for (const listener of listeners) listener();
    },
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
