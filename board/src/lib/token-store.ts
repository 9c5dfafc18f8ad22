/** A bearer token kept in localStorage, observable so screens swap to sign-in or pairing in-app. */
export interface TokenStore {
  readonly key: string;
  get: () => string | null;
  set: (token: string) => void;
  clear: () => void;
  subscribe: (listener: () => void) => () => void;
}

export function createTokenStore(key: string): TokenStore {
  const listeners = new Set<() => void>();
  // Some TV browsers refuse storage in kiosk modes: keep working from memory then.
  let memory: string | null = null;
  const read = (): string | null => {
    try {
      return localStorage.getItem(key);
    } catch {
      return memory;
    }
  };
  const write = (token: string | null) => {
    memory = token;
    try {
      if (token === null) localStorage.removeItem(key);
      else localStorage.setItem(key, token);
    } catch {
      // memory keeps it for this visit
    }
    for (const listener of listeners) listener();
  };
  if (typeof window !== 'undefined') {
    window.addEventListener('storage', (event) => {
      if (event.key === key || event.key === null) for (const listener of listeners) listener();
    });
  }
  return {
    key,
    get: read,
    set: (token) => write(token),
    clear: () => {
      if (read() !== null) write(null);
    },
    subscribe: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

export const wallToken = createTokenStore('baytime.wall.token');
export const officeToken = createTokenStore('baytime.office.token');
