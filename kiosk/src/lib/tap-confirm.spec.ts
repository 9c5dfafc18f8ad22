import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createTapConfirm, type TapConfirmState } from './tap-confirm';

function confirm() {
  const seen: TapConfirmState[] = [];
  const sut = createTapConfirm((state) => seen.push(state));
  return { sut, seen };
}

describe('createTapConfirm', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  it('ignores a second tap 100 ms after the first: a double tap never confirms', () => {
    const { sut } = confirm();
    expect(sut.tap()).toBe(false);
    vi.advanceTimersByTime(100);
    expect(sut.tap()).toBe(false);
    expect(sut.state()).toBe('arming');
  });

  it('confirms with a tap 800 ms after the first', () => {
    const { sut, seen } = confirm();
    sut.tap();
    vi.advanceTimersByTime(800);
    expect(sut.state()).toBe('armed');
    expect(sut.tap()).toBe(true);
    expect(seen).toEqual(['arming', 'armed', 'idle']);
  });

  it('shows the button armed only once the bounce window has passed', () => {
    const { sut } = confirm();
    sut.tap();
    vi.advanceTimersByTime(599);
    expect(sut.state()).toBe('arming');
    vi.advanceTimersByTime(1);
    expect(sut.state()).toBe('armed');
  });

  it('still does not confirm on a bounce of the bounce: three quick taps', () => {
    const { sut } = confirm();
    const taps = [sut.tap()];
    vi.advanceTimersByTime(100);
    taps.push(sut.tap());
    vi.advanceTimersByTime(100);
    taps.push(sut.tap());
    expect(taps).toEqual([false, false, false]);
  });

  it('falls back after the window, and the next tap starts over', () => {
    const { sut } = confirm();
    sut.tap();
    vi.advanceTimersByTime(600 + 4000);
    expect(sut.state()).toBe('idle');
    expect(sut.tap()).toBe(false);
    vi.advanceTimersByTime(100);
    expect(sut.tap()).toBe(false);
  });

  it('stops its timers on reset', () => {
    const { sut } = confirm();
    sut.tap();
    sut.reset();
    vi.advanceTimersByTime(10_000);
    expect(sut.state()).toBe('idle');
    expect(vi.getTimerCount()).toBe(0);
  });
});
