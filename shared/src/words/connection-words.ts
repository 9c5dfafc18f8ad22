import type { LinkStatus } from '../client/live-link.js';

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
