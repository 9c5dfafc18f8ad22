import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { DB, type Db } from '../db/database.js';
import { liveSequence } from '../db/schema/index.js';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { LiveService, SEQ_BLOCK } from './live.service.js';

const YEAR_MS = 365 * 24 * 60 * 60_000;

describe(LiveService.name, () => {
  const dataDir = mkdtempSync(join(tmpdir(), 'baytime-seq-'));
  let sut: TestApp | null = null;
  const start = async () => (sut = await startTestApp({ BAYTIME_DATA_DIR: dataDir }));
  afterAll(async () => {
    await sut?.close();
    rmSync(dataDir, { recursive: true, force: true });
    vi.useRealTimers();
  });

  /** Publishes `count` messages and returns the seq each went out with. */
  const publish = (app: TestApp, count: number): number[] => {
    const live = app.app.get(LiveService);
    const seqs: number[] = [];
    const subscription = live.messages$.subscribe(({ payload }) => seqs.push(payload.seq));
    for (let i = 0; i < count; i++) live.publish('timer.updated', { timerId: i, bayId: null });
    subscription.unsubscribe();
    return seqs;
  };
  const storedMark = (app: TestApp) => app.app.get<Db>(DB).select().from(liveSequence).get()?.reservedUpTo;

  it('keeps seq rising across a restart even when the clock was set back', async () => {
    const first = await start();
    const before = publish(first, 30);
    expect(before.slice(1).every((seq, i) => seq === before[i]! + 1)).toBe(true);
    const lastBefore = before.at(-1)!;
    await first.close();

    vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
    vi.setSystemTime(Date.now() - YEAR_MS);
    const second = await start();
    const owner = await second.signIn(DEMO.owner);
    const snapshot = await nextEvent(second.connect(owner), 'board.snapshot');
    expect(snapshot.seq).toBeGreaterThanOrEqual(lastBefore);
    const [after] = publish(second, 1);
    expect(after).toBeGreaterThan(lastBefore);
    expect(after).toBe(snapshot.seq + 1);
  });

  it('writes the mark once per block of messages, not once per message', async () => {
    const app = sut!;
    const [firstSeq] = publish(app, 1);
    const mark = storedMark(app)!;
    expect(mark).toBeGreaterThanOrEqual(firstSeq!);
    const rest = publish(app, mark - firstSeq!);
    expect(rest.at(-1)).toBe(mark);
    expect(storedMark(app)).toBe(mark);
    publish(app, 1);
    expect(storedMark(app)).toBe(mark + SEQ_BLOCK);
  });
});
