// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { checkDraft, checkNewPhotos, parseHours } from './finding-checks';

const MB = 1024 * 1024;
const photo = (name: string, size = 2 * MB, type = 'image/jpeg') => ({ name, size, type });

describe(checkNewPhotos.name, () => {
  it('takes photos up to six in all and says how many were left out', () => {
    const added = ['a', 'b', 'c', 'd'].map((n) => photo(`${n}.jpg`));
    const check = checkNewPhotos(4, added);
    expect(check.accepted.map((p) => p.name)).toEqual(['a.jpg', 'b.jpg']);
    expect(check.problems).toEqual([
      'Up to 6 photos per finding: 2 photos were left out. Remove one to add another.',
    ]);
  });

  it('refuses a photo over 10 MB, by name, and keeps the others', () => {
    const check = checkNewPhotos(0, [photo('big.jpg', 10 * MB + 1), photo('ok.jpg', 10 * MB)]);
    expect(check.accepted.map((p) => p.name)).toEqual(['ok.jpg']);
    expect(check.problems).toEqual(['“big.jpg” is larger than 10 MB: take it again at a smaller size.']);
  });

  it('refuses what is not a JPEG, PNG or WebP but lets an untyped camera file through', () => {
    const check = checkNewPhotos(0, [
      photo('x.heic', MB, 'image/heic'),
      photo('cam', MB, ''),
      photo('p.png', MB, 'image/png'),
    ]);
    expect(check.accepted.map((p) => p.name)).toEqual(['cam', 'p.png']);
    expect(check.problems).toEqual(['“x.heic” is not a JPEG, PNG or WebP photo.']);
  });
});

describe(parseHours.name, () => {
  it('reads hours like 1.5, allows empty, refuses the rest', () => {
    expect(parseHours('')).toBeNull();
    expect(parseHours('1.5')).toBe(1.5);
    expect(parseHours('0,5')).toBe(0.5);
    expect(parseHours('.3')).toBe(0.3);
    expect(parseHours('0')).toBe('invalid');
    expect(parseHours('120')).toBe('invalid');
    expect(parseHours('two')).toBe('invalid');
  });
});

describe(checkDraft.name, () => {
  it('asks for a note and a severity, and lets a full finding go', () => {
    expect(checkDraft({ note: '  ', severity: null, suggestedHours: '', photos: [] })).toEqual({
      note: 'Say what you found.',
      severity: 'Pick how soon it needs fixing.',
    });
    expect(
      checkDraft({
        note: 'Metal on the pan magnet',
        severity: 'soon',
        suggestedHours: '2',
        photos: [photo('a.jpg')],
      }),
    ).toEqual({});
  });

  it('refuses seven photos even if they got past the picker', () => {
    const seven = Array.from({ length: 7 }, (_, i) => photo(`${i}.jpg`));
    expect(checkDraft({ note: 'x', severity: 'watch', suggestedHours: '', photos: seven }).photos).toMatch(
      /Up to 6 photos/,
    );
  });
});
