import type { LinkStatus } from '../client/live-link.js';
import type { LiveRefusalReason } from '../live/live.events.js';

/** A screen's link to the shop server, on the wall, the office and the kiosk alike. */
export const CONNECTION_STATES = ['online', 'connecting', 'offline'] as const;
export type ConnectionState = (typeof CONNECTION_STATES)[number];

export const CONNECTION_WORDS: Readonly<Record<ConnectionState, string>> = {
  online: 'Online',
  connecting: 'Connecting…',
  offline: 'Offline',
};

/** A link down for a while: "Offline since 9:41 am". */
export function offlineSinceWords(time: string): string {
  return `${CONNECTION_WORDS.offline} since ${time}`;
}

/** A live link's status as people read it: a refused link is offline too, and says why elsewhere. */
export const LINK_STATUS_CONNECTION: Readonly<Record<LinkStatus, ConnectionState>> = {
  live: 'online',
  connecting: 'connecting',
  down: 'offline',
  refused: 'offline',
};

/** Why the server refused a live link, in words for the screen that was refused. */
export const LIVE_REFUSAL_WORDS: Record<LiveRefusalReason, string> = {
  'token-missing': 'Sign in first',
  'token-invalid': 'This sign-in is not valid here: sign in again',
  'token-expired': 'Your sign-in ran out: sign in again',
  'token-no-expiry': 'This sign-in has no expiry and is not accepted: sign in again',
  'account-inactive': 'This account is no longer active',
  'role-changed': 'Your role changed: sign in again',
  'credentials-changed': 'Your password or PIN was changed: sign in again',
  'screen-revoked': 'This screen was unpaired in the office: pair it again',
};
