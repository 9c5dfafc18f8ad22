import type { KioskQueueBody } from '@baytime/shared';
import { device, deviceApi } from '@/lib/device';
import type { OutboxEntry } from './outbox';
import { outbox } from './punch-queue';

const SETTLE_MS = 500;
const EVERY_MS = 60_000;

/** What the office and the wall are told: how many punches wait here, and since when. */
export function queueReport(entries: readonly OutboxEntry[]): KioskQueueBody {
  const oldest = entries.reduce((min, entry) => Math.min(min, entry.queuedAt), Infinity);
  return {
    waiting: entries.length,
    oldestQueuedAt: entries.length > 0 && Number.isFinite(oldest) ? new Date(oldest).toISOString() : null,
  };
}

/**
 * Tells the server how many punches wait on this kiosk whenever that changes and once a minute, while
 * the tablet is paired and the server answers. A report that does not arrive is simply made again.
 */
export function startQueueReports(): () => void {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const report = () => {
    if (device.token() === null || navigator.onLine === false) return;
    void deviceApi.post('/kiosks/me/queue', queueReport(outbox.list())).catch(() => undefined);
  };
  const soon = () => {
    clearTimeout(timer);
    timer = setTimeout(report, SETTLE_MS);
  };
  const off = outbox.subscribe(soon);
  const interval = setInterval(report, EVERY_MS);
  window.addEventListener('online', soon);
  void outbox.ready.then(soon, () => undefined);
  return () => {
    off();
    clearInterval(interval);
    clearTimeout(timer);
    window.removeEventListener('online', soon);
  };
}
