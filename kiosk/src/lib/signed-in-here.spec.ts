// @vitest-environment node
import { describe, expect, it } from 'vitest';
import {
  SIGNED_IN_KEEP_MS,
  parseSignedInHere,
  recentlySignedIn,
  withSignIn,
  type SignedInHere,
} from './signed-in-here';

const T0 = Date.parse('2026-03-10T13:00:00.000Z');
const luis = { id: 7, name: 'Luis Ortega' };
const sam = { id: 8, name: 'Sam Reyes' };

describe(withSignIn.name, () => {
  it('keeps everyone who signed in before, one entry each, the latest sign-in last', () => {
    let list: SignedInHere[] = [];
    list = withSignIn(list, luis, T0);
    list = withSignIn(list, sam, T0 + 60_000);
    list = withSignIn(list, luis, T0 + 120_000);
    expect(list).toEqual([
      { ...sam, at: T0 + 60_000 },
      { ...luis, at: T0 + 120_000 },
    ]);
  });

  it('drops those who last signed in here longer ago than a shift', () => {
    const list = withSignIn([{ ...luis, at: T0 }], sam, T0 + SIGNED_IN_KEEP_MS);
    expect(list.map((entry) => entry.id)).toEqual([sam.id]);
  });
});

describe(recentlySignedIn.name, () => {
  it('gives the names of those still within a shift of their sign-in here', () => {
    const list = [
      { ...luis, at: T0 },
      { ...sam, at: T0 + 3600_000 },
    ];
    expect(recentlySignedIn(list, T0 + 3600_000)).toEqual(
      new Map([
        [7, 'Luis Ortega'],
        [8, 'Sam Reyes'],
      ]),
    );
    expect(recentlySignedIn(list, T0 + SIGNED_IN_KEEP_MS)).toEqual(new Map([[8, 'Sam Reyes']]));
  });
});

describe(parseSignedInHere.name, () => {
  it('reads back what was stored and ignores anything else', () => {
    const list = [{ ...luis, at: T0 }];
    expect(parseSignedInHere(JSON.stringify(list))).toEqual(list);
    expect(parseSignedInHere('not json')).toEqual([]);
    expect(parseSignedInHere('{"id":7}')).toEqual([]);
    expect(parseSignedInHere(`[null, {"id":"7","name":"x","at":1}, ${JSON.stringify(list[0])}]`)).toEqual(
      list,
    );
  });
});
