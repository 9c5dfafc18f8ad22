import { describe, expect, it } from 'vitest';
import { readLiveRefusal } from './live.events.js';
import { LIVE_REFUSAL_WORDS } from '../words/connection-words.js';

describe(readLiveRefusal.name, () => {
  it('reads a refusal the server sent, in the shared words', () => {
    expect(readLiveRefusal({ reason: 'screen-revoked', message: 'anything' })).toEqual({
      reason: 'screen-revoked',
      message: LIVE_REFUSAL_WORDS['screen-revoked'],
    });
  });

  it('gives null for what is not a refusal: a network error has no data', () => {
    expect(readLiveRefusal(undefined)).toBeNull();
    expect(readLiveRefusal({ reason: 'bored' })).toBeNull();
    expect(readLiveRefusal('token-expired')).toBeNull();
  });
});
