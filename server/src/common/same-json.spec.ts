import { describe, expect, it } from 'vitest';
import { sameJson } from './same-json.js';

describe(sameJson.name, () => {
  it.each([
    [null, null],
    [1, 1],
    ['a', 'a'],
    [
      [1, [2, { a: 'x' }]],
      [1, [2, { a: 'x' }]],
    ],
    [
      { a: 1, b: { c: [true, null] } },
      { b: { c: [true, null] }, a: 1 },
    ],
    [[], []],
    [{}, {}],
  ])('finds %j and %j equal', (a, b) => expect(sameJson(a, b)).toBe(true));

  it.each([
    [null, {}],
    [0, null],
    [1, '1'],
    [
      [1, 2],
      [1, 2, 3],
    ],
    [
      [1, 2, 3],
      [1, 2],
    ],
    [{ a: 1 }, { a: 1, b: 2 }],
    [{ a: 1, b: 2 }, { a: 1 }],
    [
      { a: 1, b: undefined },
      { a: 1, c: undefined },
    ],
    [{ a: { b: [1, { c: 'x' }] } }, { a: { b: [1, { c: 'y' }] } }],
    [[], {}],
    [{ 0: 'a', length: 1 }, ['a']],
  ])('finds %j and %j different', (a, b) => expect(sameJson(a, b)).toBe(false));

  it('leaves out the ignored keys of the outermost object only', () => {
    const ticking = new Set(['seconds']);
    expect(sameJson({ id: 1, seconds: 10 }, { id: 1, seconds: 12 }, ticking)).toBe(true);
    expect(sameJson({ id: 1, seconds: 10 }, { id: 2, seconds: 10 }, ticking)).toBe(false);
    expect(sameJson({ inner: { seconds: 1 } }, { inner: { seconds: 2 } }, ticking)).toBe(false);
  });
});
