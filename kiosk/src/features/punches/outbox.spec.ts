// @vitest-environment node
import 'fake-indexeddb/auto';
import { createStore, keys } from 'idb-keyval';
import { describe, expect, it, vi } from 'vitest';
import {
  OUTBOX_KEY,
  backoffMs,
  classifyFailure,
  createOutbox,
  drainOutbox,
  idbOutboxStore,
  type NewOutboxEntry,
  type OutboxEntry,
  type OutboxStore,
  type SendOutcome,
} from './outbox';

/** A fresh IndexedDB database per test (fake-indexeddb in node), as the app's outbox uses one. */
let databases = 0;
function idbStore() {
  databases += 1;
  const raw = createStore(`outbox-test-${databases}`, 'outbox');
  return { raw, store: idbOutboxStore(raw) };
}

async function newOutbox(store: OutboxStore = idbStore().store) {
  const outbox = createOutbox(store);
  await outbox.ready;
  return outbox;
}

/** localStorage as a tablet left it before the move to IndexedDB. */
function oldLocalStorage(value: string | null) {
  const data = new Map<string, string>(value === null ? [] : [[OUTBOX_KEY, value]]);
  return {
    data,
    getItem: (key: string) => data.get(key) ?? null,
    removeItem: (key: string) => void data.delete(key),
  };
}

let counter = 0;
function punch(
  technicianId = 7,
  kind: NewOutboxEntry['punch']['kind'] = 'shift-in',
  token = `token-${technicianId}`,
) {
  counter += 1;
  const id = `00000000-0000-4000-8000-${String(counter).padStart(12, '0')}`;
  return {
    punch: { id, kind, at: '2026-03-10T07:02:00.000-05:00' },
    token,
    technicianId,
    technicianName: `Tech ${technicianId}`,
    label: kind,
  } satisfies NewOutboxEntry;
}

function clock(start = 1_000_000) {
  let t = start;
  return { now: () => t, advance: (ms: number) => (t += ms) };
}

function sender(answers: Record<string, SendOutcome[]> = {}) {
  const calls: OutboxEntry[] = [];
  const send = vi.fn(async (entry: OutboxEntry): Promise<SendOutcome> => {
    calls.push(entry);
    return answers[entry.punch.id]?.shift() ?? { kind: 'sent' };
  });
  return { send, calls, ids: () => calls.map((c) => c.punch.id) };
}

describe('createOutbox', () => {
  it('writes each tap to IndexedDB, one record per punch, and reads it back after a reload', async () => {
    const { raw, store } = idbStore();
    const sut = await newOutbox(store);
    const a = punch();
    const b = punch(7, 'job-on');
    await sut.add([a, b], 5);

    expect((await keys(raw)).sort()).toEqual([a.punch.id, b.punch.id].sort());
    const again = await newOutbox(store);
    expect(again.list().map((e) => e.punch.id)).toEqual([a.punch.id, b.punch.id]);
    expect(again.list()[0]).toMatchObject({
      attempts: 0,
      nextAttemptAt: 5,
      waitingForSignIn: false,
      token: 'token-7',
    });
  });

  it('keeps a large queue in order across a reload, changes included', async () => {
    const { store } = idbStore();
    const sut = await newOutbox(store);
    // Each batch differs from the one before: a repeated tap would be dropped as a double tap.
    const taps = Array.from({ length: 600 }, (_, i) =>
      punch(7 + (i % 3), Math.floor(i / 50) % 2 ? 'shift-out' : 'shift-in'),
    );
    for (let i = 0; i < taps.length; i += 50) await sut.add(taps.slice(i, i + 50), i);
    sut.remove(taps[0]!.punch.id);
    sut.update(taps[1]!.punch.id, { attempts: 4, lastError: 'No connection' });
    await sut.flushed();

    const again = await newOutbox(store);
    expect(again.list().map((e) => e.punch.id)).toEqual(taps.slice(1).map((t) => t.punch.id));
    expect(again.list()[0]).toMatchObject({ attempts: 4, lastError: 'No connection' });
  });

  it('drops a double tap: the same punch again while the first is being written or still queued', async () => {
    const sut = await newOutbox();
    const onLine = () => {
      const entry = punch(7, 'job-on');
      return { ...entry, punch: { ...entry.punch, jobLineId: 31 } };
    };
    const first = onLine();
    const bounce = onLine();
    // The bounce comes while the first tap's write is still under way.
    const [a, b] = await Promise.all([sut.add([first], 1_000), sut.add([bounce], 1_100)]);
    expect([a, b]).toEqual([true, false]);
    expect(sut.list().map((e) => e.punch.id)).toEqual([first.punch.id]);

    expect(await sut.add([onLine()], 60_000)).toBe(false);
  });

  it('drops the same tap just after the first went out, but not a repeat well after it', async () => {
    const sut = await newOutbox();
    const first = punch(7, 'shift-in');
    await sut.add([first], 1_000);
    sut.remove(first.punch.id);
    expect(await sut.add([punch(7, 'shift-in')], 1_000 + 500)).toBe(false);
    expect(await sut.add([punch(7, 'shift-in')], 1_000 + 5_000)).toBe(true);
  });

  it('queues the same punch for another technician, and a different punch at once', async () => {
    const sut = await newOutbox();
    await sut.add([punch(7, 'shift-in')], 1_000);
    expect(await sut.add([punch(8, 'shift-in')], 1_050)).toBe(true);
    expect(await sut.add([punch(7, 'break-start')], 1_100)).toBe(true);
    expect(sut.list()).toHaveLength(3);
  });

  it('takes the same tap again after a write the store refused', async () => {
    const { store } = idbStore();
    let refuse = true;
    const flaky: OutboxStore = {
      ...store,
      put: (entries) => (refuse ? Promise.reject(new Error('QuotaExceededError')) : store.put(entries)),
    };
    const sut = await newOutbox(flaky);
    await expect(sut.add([punch(7, 'shift-in')], 1_000)).rejects.toThrow('QuotaExceededError');
    refuse = false;
    expect(await sut.add([punch(7, 'shift-in')], 1_100)).toBe(true);
  });

  it('queues nothing and rejects when IndexedDB refuses the write', async () => {
    const { store } = idbStore();
    const refusing: OutboxStore = { ...store, put: () => Promise.reject(new Error('QuotaExceededError')) };
    const sut = await newOutbox(refusing);
    await expect(sut.add([punch()], 0)).rejects.toThrow('QuotaExceededError');
    expect(sut.list()).toEqual([]);
    expect((await newOutbox(store)).list()).toEqual([]);
  });

  it('ignores a punch id that is already queued', async () => {
    const sut = await newOutbox();
    const a = punch();
    await sut.add([a], 0);
    await sut.add([a], 1);
    expect(sut.list()).toHaveLength(1);
  });

  it('moves what a tablet holds in localStorage into IndexedDB on first start, then drops the old copy', async () => {
    const { store } = idbStore();
    const [a, b] = [punch(), punch(8, 'job-on')];
    const old = oldLocalStorage(JSON.stringify([{ ...a, attempts: 2 }, { nonsense: true }, b]));
    const sut = createOutbox(store, old);
    await sut.ready;
    expect(sut.list().map((e) => [e.punch.id, e.attempts])).toEqual([
      [a.punch.id, 2],
      [b.punch.id, 0],
    ]);
    expect(old.data.has(OUTBOX_KEY)).toBe(false);
    // Read again without the old copy: the punches are in IndexedDB now, after anything queued since.
    const c = punch();
    await sut.add([c], 9);
    expect((await newOutbox(store)).list().map((e) => e.punch.id)).toEqual([
      a.punch.id,
      b.punch.id,
      c.punch.id,
    ]);
  });

  it('keeps the old localStorage copy when IndexedDB refuses the move, and treats junk as empty', async () => {
    const { store } = idbStore();
    const old = oldLocalStorage(JSON.stringify([punch()]));
    const refusing: OutboxStore = { ...store, put: () => Promise.reject(new Error('blocked')) };
    await expect(createOutbox(refusing, old).ready).rejects.toThrow('blocked');
    expect(old.data.has(OUTBOX_KEY)).toBe(true);
    const junk = oldLocalStorage('{not json');
    const sut = createOutbox(store, junk);
    await sut.ready;
    expect(sut.list()).toEqual([]);
  });

  it('keeps the same list object until something changes, and tells subscribers', async () => {
    const sut = await newOutbox();
    const listener = vi.fn();
    sut.subscribe(listener);
    const before = sut.list();
    expect(sut.list()).toBe(before);
    await sut.add([punch()], 0);
    expect(listener).toHaveBeenCalledTimes(1);
    expect(sut.list()).not.toBe(before);
  });

  it('deletes the record of a punch once it is gone', async () => {
    const { raw, store } = idbStore();
    const sut = await newOutbox(store);
    const a = punch();
    await sut.add([a], 0);
    sut.remove(a.punch.id);
    await sut.flushed();
    expect(await keys(raw)).toEqual([]);
  });
});

describe(classifyFailure.name, () => {
  it.each([
    [0, 'retry'],
    [500, 'retry'],
    [503, 'retry'],
    [429, 'retry'],
    [401, 'unauthorized'],
    [409, 'refused'],
    [400, 'refused'],
    [403, 'refused'],
  ] as const)('status %i → %s', (status, kind) => {
    expect(classifyFailure(status, 'why').kind).toBe(kind);
  });

  it('stops everything when there is no answer at all, only one technician on a 5xx', () => {
    expect(classifyFailure(0, '')).toMatchObject({ scope: 'all' });
    expect(classifyFailure(502, '')).toMatchObject({ scope: 'technician' });
  });
});

describe(backoffMs.name, () => {
  it('doubles from one second and stops at a minute', () => {
    const mid = () => 0.5;
    expect([1, 2, 3, 4, 7, 8, 30].map((n) => backoffMs(n, mid))).toEqual([
      1000, 2000, 4000, 8000, 60_000, 60_000, 60_000,
    ]);
  });

  it('spreads retries by at most 20 % either way', () => {
    expect(backoffMs(3, () => 0)).toBe(3200);
    expect(backoffMs(3, () => 0.999999)).toBe(4800);
  });
});

describe(drainOutbox.name, () => {
  it('sends punches oldest first and drops each one the server took', async () => {
    const sut = await newOutbox();
    const entries = [punch(), punch(7, 'job-on'), punch(7, 'job-off')];
    await sut.add(entries, 0);
    const { send, ids } = sender();
    const onSent = vi.fn();

    const result = await drainOutbox(sut, send, { now: clock().now, onSent });

    expect(ids()).toEqual(entries.map((e) => e.punch.id));
    expect(result).toEqual({ sent: 3, refused: 0, nextAttemptAt: null });
    expect(onSent).toHaveBeenCalledTimes(3);
    expect(sut.list()).toEqual([]);
  });

  it('drops a refused punch, reports why, and goes on with the next', async () => {
    const sut = await newOutbox();
    const [a, b] = [punch(7, 'break-end'), punch(7, 'shift-out')];
    await sut.add([a, b], 0);
    const { send, ids } = sender({ [a.punch.id]: [{ kind: 'refused', message: 'Not on a break' }] });
    const onRefused = vi.fn();

    const result = await drainOutbox(sut, send, { now: clock().now, onRefused });

    expect(onRefused).toHaveBeenCalledWith(expect.objectContaining({ punch: a.punch }), 'Not on a break');
    expect(ids()).toEqual([a.punch.id, b.punch.id]);
    expect(result).toMatchObject({ sent: 1, refused: 1 });
    expect(sut.list()).toEqual([]);
  });

  it('keeps every punch when the link is down, backs off, and sends them in order later', async () => {
    const time = clock();
    const sut = await newOutbox();
    const [a, b] = [punch(7), punch(8)];
    await sut.add([a, b], time.now());
    const down = sender({ [a.punch.id]: [{ kind: 'retry', scope: 'all', message: 'No connection' }] });

    const first = await drainOutbox(sut, down.send, { now: time.now, random: () => 0.5 });

    expect(down.ids()).toEqual([a.punch.id]);
    expect(first).toEqual({ sent: 0, refused: 0, nextAttemptAt: time.now() + 1000 });
    expect(sut.list()).toHaveLength(2);
    expect(sut.list()[0]).toMatchObject({ attempts: 1, lastError: 'No connection' });

    const early = sender();
    await drainOutbox(sut, early.send, { now: time.now });
    expect(early.send).not.toHaveBeenCalled();

    time.advance(1000);
    const later = sender();
    const second = await drainOutbox(sut, later.send, { now: time.now });
    expect(later.ids()).toEqual([a.punch.id, b.punch.id]);
    expect(second.sent).toBe(2);
    expect(sut.list()).toEqual([]);
  });

  it('treats a thrown send as a dropped link, never as a loss', async () => {
    const sut = await newOutbox();
    await sut.add([punch()], 0);
    const result = await drainOutbox(sut, () => Promise.reject(new Error('boom')), { now: () => 0 });
    expect(result.sent).toBe(0);
    expect(sut.list()).toHaveLength(1);
  });

  it("holds back one technician's later punches behind a retry, not other technicians'", async () => {
    const sut = await newOutbox();
    const [a1, b1, a2] = [punch(7), punch(8), punch(7, 'job-on')];
    await sut.add([a1, b1, a2], 0);
    const { send, ids } = sender({
      [a1.punch.id]: [{ kind: 'retry', scope: 'technician', message: 'Server error' }],
    });

    const result = await drainOutbox(sut, send, { now: () => 0, random: () => 0.5 });

    expect(ids()).toEqual([a1.punch.id, b1.punch.id]);
    expect(result.nextAttemptAt).toBe(1000);
    expect(sut.list().map((e) => e.punch.id)).toEqual([a1.punch.id, a2.punch.id]);
  });

  it('keeps a punch whose token ran out until the same technician signs in again', async () => {
    const sut = await newOutbox();
    const [a, b] = [punch(7, 'shift-out', 'old-token'), punch(8)];
    await sut.add([a, b], 0);
    const first = sender({ [a.punch.id]: [{ kind: 'unauthorized', message: 'Unauthorized' }] });

    await drainOutbox(sut, first.send, { now: () => 0 });
    expect(first.ids()).toEqual([a.punch.id, b.punch.id]);
    expect(sut.list()).toEqual([expect.objectContaining({ punch: a.punch, waitingForSignIn: true })]);

    const idle = sender();
    await drainOutbox(sut, idle.send, { now: () => 10 });
    expect(idle.send).not.toHaveBeenCalled();

    sut.renewToken(7, 'new-token', 20);
    const after = sender();
    await drainOutbox(sut, after.send, { now: () => 20 });
    expect(after.calls.map((c) => c.token)).toEqual(['new-token']);
    expect(sut.list()).toEqual([]);
  });

  it('tries at once when the link comes back, without waiting out the backoff', async () => {
    const time = clock();
    const sut = await newOutbox();
    await sut.add([punch()], time.now());
    await drainOutbox(sut, async () => ({ kind: 'retry', scope: 'all', message: 'x' }), {
      now: time.now,
      random: () => 0.5,
    });
    sut.retryNow(time.now());
    const { send } = sender();
    const result = await drainOutbox(sut, send, { now: time.now });
    expect(result.sent).toBe(1);
  });

  it('also sends a punch tapped while the drain is under way, after the earlier ones', async () => {
    const sut = await newOutbox();
    const [a, b] = [punch(7), punch(7, 'job-on')];
    await sut.add([a], 0);
    const order: string[] = [];
    await drainOutbox(
      sut,
      async (entry) => {
        order.push(entry.punch.id);
        if (entry.punch.id === a.punch.id) await sut.add([b], 1);
        return { kind: 'sent' };
      },
      { now: () => 1 },
    );
    expect(order).toEqual([a.punch.id, b.punch.id]);
  });
});
