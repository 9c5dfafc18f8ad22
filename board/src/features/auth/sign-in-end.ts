import type { TokenStore } from '@/lib/token-store';
import { tokenLife, type TokenLife } from './sign-in-renewal';

/** The office warns this long before its last token runs out: time to finish and sign in again. */
export const NOTICE_BEFORE_MS = 10 * 60_000;
/** A wait is checked again at least this often: a computer that slept wakes to the right notice. */
export const RECHECK_MS = 60_000;

/** What the office knows of one sign-in besides its token, for the sign-in made at `signedInAt` (ms). */
export interface SignInRecord {
  signedInAt: number;
  /** Until when the server renews it (ms): as its answers say, or when it refused a renewal. */
  renewableUntil?: number;
  /** The e-mail it was made with, so that signing in again asks only for the password. */
  email?: string;
}

export interface SignInRecords {
  /** The record of the sign-in `token` belongs to, if one was kept. */
  of(token: string | null): SignInRecord | null;
  /** A sign-in or renewal answered with `token`: what the answer said, and the e-mail given for it. */
  answered(token: string, answer: { renewableUntil?: string }, email?: string): void;
  /** The server refused to renew `token` at `now`: its sign-in is renewed no longer. */
  refused(token: string, now: number): void;
  clear(): void;
  subscribe(listener: () => void): () => void;
}

/** Records kept as JSON in `store` (localStorage in the office, so every tab sees one sign-in). */
export function createSignInRecords(
  store: Pick<TokenStore, 'get' | 'set' | 'clear' | 'subscribe'>,
): SignInRecords {
  const read = (): SignInRecord | null => {
    try {
      const value = JSON.parse(store.get() ?? 'null') as Partial<Record<keyof SignInRecord, unknown>> | null;
      if (typeof value?.signedInAt !== 'number') return null;
      const record: SignInRecord = { signedInAt: value.signedInAt };
      if (typeof value.renewableUntil === 'number') record.renewableUntil = value.renewableUntil;
      if (typeof value.email === 'string') record.email = value.email;
      return record;
    } catch {
      return null;
    }
  };
  const signedInAt = (token: string | null) => (token ? tokenLife(token)?.signedInAt : undefined);
  const of = (token: string | null) => {
    const at = signedInAt(token);
    const record = at === undefined ? null : read();
    return record?.signedInAt === at ? record : null;
  };
  /** Changes the record of `token`'s sign-in, started afresh for a sign-in not kept before. */
  const change = (token: string, update: (record: SignInRecord) => SignInRecord) => {
    const at = signedInAt(token);
    if (at === undefined) return;
    store.set(JSON.stringify(update(of(token) ?? { signedInAt: at })));
  };
  return {
    of,
    answered(token, { renewableUntil }, email) {
      const until = renewableUntil === undefined ? NaN : Date.parse(renewableUntil);
      change(token, (record) => ({
        ...record,
        ...(Number.isFinite(until) && { renewableUntil: until }),
        ...(email !== undefined && { email }),
      }));
    },
    refused(token, now) {
      change(token, (record) => ({ ...record, renewableUntil: Math.min(record.renewableUntil ?? now, now) }));
    },
    clear: () => store.clear(),
    subscribe: (listener) => store.subscribe(listener),
  };
}

/**
 * When the office shows that its sign-in ends (`noticeAt`) and when it ends (`endsAt`, ms), or null
 * while the token can still be renewed (or nothing says until when). A token runs out at its own time;
 * the notice waits until it is the last one, i.e. once its sign-in is renewed no longer.
 */
export function signInEnd(
  life: TokenLife,
  record: SignInRecord | null,
): { noticeAt: number; endsAt: number } | null {
  const until = record?.renewableUntil;
  if (until === undefined || until >= life.expiresAt) return null;
  return { noticeAt: Math.max(life.expiresAt - NOTICE_BEFORE_MS, until), endsAt: life.expiresAt };
}

/** The notice shown: when the sign-in ends (ms). */
export interface SignInEndNotice {
  endsAt: number;
}

export interface SignInEndWatch {
  /** The notice to show now, or null; the same object until it changes. */
  get(): SignInEndNotice | null;
  /** Watches the token, its record and the clock while anyone listens. */
  subscribe(listener: () => void): () => void;
}

export function createSignInEndWatch({
  tokens,
  records,
  now = Date.now,
}: {
  tokens: Pick<TokenStore, 'get' | 'subscribe'>;
  records: Pick<SignInRecords, 'of' | 'subscribe'>;
  now?: () => number;
}): SignInEndWatch {
  const listeners = new Set<() => void>();
  let notice: SignInEndNotice | null = null;
  let timer: ReturnType<typeof setTimeout> | undefined;
  let stopWatching = () => {};

  const update = () => {
    clearTimeout(timer);
    timer = undefined;
    const token = tokens.get();
    const life = token ? tokenLife(token) : null;
    const end = life ? signInEnd(life, records.of(token)) : null;
    const at = now();
    const endsAt = end && at >= end.noticeAt && at < end.endsAt ? end.endsAt : null;
    if ((notice?.endsAt ?? null) !== endsAt) {
      notice = endsAt === null ? null : { endsAt };
      for (const listener of listeners) listener();
    }
    if (!end || at >= end.endsAt || listeners.size === 0) return;
    const next = at < end.noticeAt ? end.noticeAt : end.endsAt;
    timer = setTimeout(update, Math.min(next - at, RECHECK_MS));
  };

  return {
    get: () => notice,
    subscribe(listener) {
      listeners.add(listener);
      if (listeners.size === 1) {
        const stops = [tokens.subscribe(update), records.subscribe(update)];
        stopWatching = () => stops.forEach((stop) => stop());
        update();
      }
      return () => {
        listeners.delete(listener);
        if (listeners.size > 0) return;
        stopWatching();
        clearTimeout(timer);
        timer = undefined;
      };
    },
  };
}
