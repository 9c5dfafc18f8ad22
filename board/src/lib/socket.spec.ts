import { describe, expect, it, vi } from 'vitest';
import type { LinkState, LinkStatus } from '@baytime/shared/client';
import { whenLive } from './socket';

/** A link's state and its listeners, moved by the test. */
function fakeLink(status: LinkStatus) {
  let state: LinkState = { status, downSince: null, refusal: null };
  const listeners = new Set<() => void>();
  return {
    getState: () => state,
    subscribe: (listener: () => void) => {
      listeners.add(listener);
      return () => void listeners.delete(listener);
    },
    become(next: LinkStatus) {
      state = { ...state, status: next };
      for (const listener of [...listeners]) listener();
    },
    listeners,
  };
}

describe(whenLive.name, () => {
  it('runs once the link goes live, once, and stops listening', () => {
    const link = fakeLink('connecting');
    const action = vi.fn();
    whenLive(link, action);
    link.become('down');
    expect(action).not.toHaveBeenCalled();
    link.become('live');
    link.become('down');
    link.become('live');
    expect(action).toHaveBeenCalledTimes(1);
    expect(link.listeners.size).toBe(0);
  });

  it('runs at once on a link already live, and never after being stopped', () => {
    const live = vi.fn();
    whenLive(fakeLink('live'), live);
    expect(live).toHaveBeenCalledTimes(1);

    const link = fakeLink('connecting');
    const stopped = vi.fn();
    whenLive(link, stopped)();
    link.become('live');
    expect(stopped).not.toHaveBeenCalled();
  });
});
