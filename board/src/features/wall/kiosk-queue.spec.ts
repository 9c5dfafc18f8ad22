import { describe, expect, it } from 'vitest';
import { kioskQueueText } from './kiosk-queue';

const ZONE = 'America/Chicago';

describe(kioskQueueText.name, () => {
  it('says nothing when no kiosk holds a punch', () => {
    expect(kioskQueueText([], ZONE)).toBeNull();
    expect(kioskQueueText([{ kioskId: 1, name: 'Front kiosk', waiting: 0, since: null }], ZONE)).toBeNull();
  });

  it('names the kiosk and since when, in shop time', () => {
    // 13:02Z on 3 Mar 2026 is 7:02 am CST (UTC−6).
    const one = [{ kioskId: 1, name: 'Front kiosk', waiting: 3, since: '2026-03-03T13:02:00Z' }];
    expect(kioskQueueText(one, ZONE)).toBe('3 punches waiting since 7:02 am · Front kiosk');
    expect(kioskQueueText([{ ...one[0]!, waiting: 1 }], ZONE)).toBe(
      '1 punch waiting since 7:02 am · Front kiosk',
    );
  });

  it('sums over kiosks from the oldest', () => {
    const two = [
      { kioskId: 1, name: 'Front kiosk', waiting: 3, since: '2026-03-03T13:02:00Z' },
      { kioskId: 2, name: 'Back kiosk', waiting: 2, since: '2026-03-03T12:45:00Z' },
    ];
    expect(kioskQueueText(two, ZONE)).toBe('5 punches waiting since 6:45 am · 2 kiosks');
  });
});
