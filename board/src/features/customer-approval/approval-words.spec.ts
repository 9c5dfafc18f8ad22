import { describe, expect, it } from 'vitest';
import { ApiError } from '@baytime/shared/client';
import { hoursText, shopTimeText, unavailableText } from './approval-words';

describe('customer approval words', () => {
  it('says why a link cannot be shown, with the server’s reason for a closed one', () => {
    expect(unavailableText(new ApiError(404, 'x')).title).toBe('This link does not work');
    expect(unavailableText(new ApiError(410, 'This link has expired: call the shop for a new one'))).toEqual({
      title: 'This link is closed',
      text: 'This link has expired: call the shop for a new one',
    });
    expect(unavailableText(new ApiError(429, 'x')).title).toBe('Too many tries');
    expect(unavailableText(new ApiError(0, 'x')).title).toBe('No connection');
    expect(unavailableText(new Error('x')).title).toBe('Something went wrong');
  });

  it('writes hours without float noise', () => {
    expect(hoursText(1.5)).toBe('1.5 h');
    expect(hoursText(0.1 + 0.2)).toBe('0.3 h');
  });

  it('states a time on the shop’s clock, named as such, whatever zone the page is read in', () => {
    const instant = '2026-12-03T23:30:00Z';
    expect(shopTimeText(instant, 'America/Chicago')).toBe('Thu, Dec 3, 5:30 pm (shop time)');
    expect(shopTimeText(instant, 'Europe/Berlin')).toBe('Fri, Dec 4, 12:30 am (shop time)');
  });
});
