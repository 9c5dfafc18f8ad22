import type { Role } from '@baytime/shared';

export type Method = 'get' | 'post' | 'patch' | 'delete';
export const ALL_ROLES: Role[] = ['owner', 'foreman', 'advisor', 'technician', 'display'];

/** GET routes anyone may read without a token. */
export const PUBLIC_GET_ROUTES = ['/api/health', '/api/openapi.json', '/api/docs'];

/** Every route with the roles allowed past the guard; anything else answers 401 or 403. */
export const ROUTES: [Method, string, Role[]][] = [
  ['get', '/api/me', ALL_ROLES],
  ['get', '/api/me/day', ['technician']],
  ['get', '/api/users', ['owner', 'foreman']],
  ['post', '/api/users', ['owner']],
  ['patch', '/api/users/1', ['owner']],
  ['get', '/api/bays', ALL_ROLES],
  ['post', '/api/bays', ['owner']],
  ['patch', '/api/bays/1', ['owner']],
  ['get', '/api/screens', ['owner', 'foreman']],
  ['post', '/api/screens', ['owner', 'foreman']],
  ['delete', '/api/screens/999', ['owner', 'foreman']],
  ['get', '/api/shop', ALL_ROLES],
  ['patch', '/api/shop', ['owner']],
  ['get', '/api/board', ALL_ROLES],
  ['post', '/api/punches', ['technician', 'foreman', 'owner']],
  ['get', '/api/repair-orders', ['owner', 'foreman', 'advisor']],
  ['post', '/api/repair-orders', ['owner', 'foreman', 'advisor']],
  ['get', '/api/repair-orders/1', ['owner', 'foreman', 'advisor']],
  ['get', '/api/vehicles', ['owner', 'foreman', 'advisor']],
  ['get', '/api/operations', ['owner', 'foreman', 'advisor']],
  ['post', '/api/operations', ['owner']],
  ['patch', '/api/operations/1', ['owner']],
  ['get', '/api/dispatch', ['foreman', 'owner', 'advisor']],
  ['post', '/api/bays/8/release', ['owner', 'foreman', 'advisor']],
  ['patch', '/api/job-lines/1', ['foreman', 'owner']],
  ['post', '/api/job-lines/1/hold', ['technician', 'foreman', 'owner']],
  ['post', '/api/job-lines/1/resume', ['technician', 'foreman', 'owner']],
  ['post', '/api/job-lines/1/done', ['technician', 'foreman', 'owner']],
  ['get', '/api/timecards', ['technician', 'foreman', 'owner']],
  ['post', '/api/timecards/corrections', ['foreman', 'owner']],
  ['get', '/api/reports/labour', ['owner', 'foreman']],
  ['get', '/api/reports/pay', ['owner']],
  ['get', '/api/timers', ['technician', 'foreman', 'owner']],
  ['post', '/api/timers', ['technician', 'foreman']],
  ['post', '/api/timers/1/readings', ['technician', 'foreman']],
  ['post', '/api/timers/1/stop', ['technician', 'foreman', 'owner']],
  ['get', '/api/hold-presets', ALL_ROLES],
  ['post', '/api/hold-presets', ['owner']],
  ['delete', '/api/hold-presets/999', ['owner']],
  ['post', '/api/job-lines/1/findings', ['technician', 'foreman', 'owner']],
  ['get', '/api/findings', ['advisor', 'foreman', 'owner']],
  ['post', '/api/findings/999/answer', ['advisor', 'foreman', 'owner']],
  ['post', '/api/findings/999/request-approval', ['advisor']],
  ['get', '/api/attachments/999', ['owner', 'foreman', 'advisor', 'technician']],
  ['get', '/api/attachments/999/preview', ['owner', 'foreman', 'advisor', 'technician']],
  ['post', '/api/repair-orders/1/ready-notice', ['advisor']],
  ['get', '/api/mailbox', ['owner']],
  ['get', '/api/mailbox/00000000-0000-4000-8000-000000000000', ['owner']],
];
