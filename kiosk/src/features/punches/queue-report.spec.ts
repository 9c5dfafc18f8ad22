// @vitest-environment node
import { describe, expect, it, vi } from 'vitest';
import type { OutboxEntry } from './outbox';

vi.mock('./punch-queue', () => ({ outbox: {} }));
vi.mock('@/lib/device', () => ({ device: {}, deviceApi: {} }));
const { queueReport } = await import('./queue-report');

const entry = (queuedAt: number) => ({ queuedAt }) as OutboxEntry;

describe(queueReport.name, () => {
  it('counts the waiting punches and gives the oldest one’s queueing time', () => {
    expect(
      queueReport([entry(Date.parse('2026-03-10T13:05:00Z')), entry(Date.parse('2026-03-10T13:02:00Z'))]),
    ).toEqual({
      waiting: 2,
      oldestQueuedAt: '2026-03-10T13:02:00.000Z',
    });
    expect(queueReport([])).toEqual({ waiting: 0, oldestQueuedAt: null });
  });
});
