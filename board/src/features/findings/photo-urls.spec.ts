import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPhotoUrls } from './photo-urls';

describe(createPhotoUrls.name, () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  const setup = () => {
    let made = 0;
    const revoked: string[] = [];
    const sut = createPhotoUrls(
      { create: () => `blob:${++made}`, revoke: (url) => revoked.push(url) },
      1_000,
    );
    return { sut, revoked };
  };

  it('gives every user of a blob the same URL', () => {
    const { sut } = setup();
    const blob = new Blob(['a']);
    expect(sut.urlFor(blob)).toBe(sut.urlFor(blob));
    expect(sut.urlFor(new Blob(['b']))).not.toBe(sut.urlFor(blob));
  });

  it('frees a URL a moment after its last user lets go', () => {
    const { sut, revoked } = setup();
    const blob = new Blob(['a']);
    const url = sut.urlFor(blob);
    sut.retain(blob);
    sut.retain(blob);
    sut.release(blob);
    vi.advanceTimersByTime(5_000);
    expect(revoked).toEqual([]);
    sut.release(blob);
    vi.advanceTimersByTime(999);
    expect(revoked).toEqual([]);
    vi.advanceTimersByTime(1);
    expect(revoked).toEqual([url]);
    expect(sut.size()).toBe(0);
  });

  it('keeps the URL when a user comes back within the moment (a remount)', () => {
    const { sut, revoked } = setup();
    const blob = new Blob(['a']);
    const url = sut.urlFor(blob);
    sut.retain(blob);
    sut.release(blob);
    sut.retain(blob);
    vi.advanceTimersByTime(10_000);
    expect(revoked).toEqual([]);
    expect(sut.urlFor(blob)).toBe(url);
  });
});
