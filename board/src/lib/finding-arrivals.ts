/**
 * Findings that came in while this office window was open and nobody has looked at yet: the menu
 * counts them and the inbox marks them. Opening the inbox and leaving it again clears them.
 */
let arrived: ReadonlySet<number> = new Set();
const listeners = new Set<() => void>();

function set(next: ReadonlySet<number>) {
  arrived = next;
  for (const listener of listeners) listener();
}

export const findingArrivals = {
  get: (): ReadonlySet<number> => arrived,
  add: (findingId: number) => set(new Set(arrived).add(findingId)),
  seen(findingId: number) {
    if (!arrived.has(findingId)) return;
    const next = new Set(arrived);
    next.delete(findingId);
    set(next);
  },
  clear: () => {
    if (arrived.size > 0) set(new Set());
  },
  subscribe(listener: () => void) {
    listeners.add(listener);
    return () => void listeners.delete(listener);
  },
};
