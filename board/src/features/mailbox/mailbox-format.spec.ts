import { describe, expect, it } from 'vitest';
import { formatBytes, receivedText, recipientsText, splitAddress } from './mailbox-format';

describe('mailbox formats', () => {
  it('writes sizes a person reads', () => {
    expect(formatBytes(812)).toBe('812 B');
    expect(formatBytes(14_500)).toBe('14 KB');
    expect(formatBytes(2_400_000)).toBe('2.3 MB');
  });

  it('shortens a list of recipients', () => {
    expect(recipientsText([])).toBe('(no recipient)');
    expect(recipientsText(['ada@example.test'])).toBe('ada@example.test');
    expect(recipientsText(['a@x.test', 'b@x.test', 'c@x.test'])).toBe('a@x.test and 2 more');
  });

  it('splits a sender into name and address', () => {
    expect(splitAddress('"Marlow Creek Auto Care" <shop@marlowcreek.test>')).toEqual({
      name: 'Marlow Creek Auto Care',
      address: 'shop@marlowcreek.test',
    });
    expect(splitAddress('shop@marlowcreek.test')).toEqual({ name: null, address: 'shop@marlowcreek.test' });
  });

  it('says when a message came as briefly as it can', () => {
    const now = new Date('2026-12-01T22:00:00Z');
    expect(receivedText('2026-12-01T20:05:00Z', now, 'America/Chicago')).toBe('2:05 pm');
    expect(receivedText('2026-11-29T20:05:00Z', now, 'America/Chicago')).toBe('Sun 2:05 pm');
    expect(receivedText('2026-10-02T20:05:00Z', now, 'America/Chicago')).toBe('Oct 2, 2026');
  });
});
