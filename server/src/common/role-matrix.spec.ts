import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@baytime/shared';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { ROLE_REFUSAL, SignedInGuard } from './guards/auth.guard.js';

type Method = 'get' | 'post' | 'patch' | 'delete';
const ALL: Role[] = ['owner', 'foreman', 'advisor', 'technician', 'display'];

/** Every route with the roles allowed past the guard; anything else answers 401 or 403. */
const ROUTES: [Method, string, Role[]][] = [
  ['get', '/api/me', ALL],
  ['get', '/api/me/day', ['technician']],
  ['get', '/api/users', ['owner', 'foreman']],
  ['post', '/api/users', ['owner']],
  ['patch', '/api/users/1', ['owner']],
  ['get', '/api/bays', ALL],
  ['post', '/api/bays', ['owner']],
  ['patch', '/api/bays/1', ['owner']],
  ['get', '/api/screens', ['owner', 'foreman']],
  ['post', '/api/screens', ['owner', 'foreman']],
  ['delete', '/api/screens/999', ['owner', 'foreman']],
  ['get', '/api/shop', ALL],
  ['patch', '/api/shop', ['owner']],
  ['get', '/api/board', ALL],
  ['post', '/api/punches', ['technician', 'foreman', 'owner']],
  ['get', '/api/repair-orders', ['owner', 'foreman', 'advisor']],
  ['post', '/api/repair-orders', ['owner', 'foreman', 'advisor']],
  ['get', '/api/repair-orders/1', ['owner', 'foreman', 'advisor']],
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
  ['get', '/api/hold-presets', ALL],
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

describe(SignedInGuard.name, () => {
  let sut: TestApp;
  const tokens = {} as Record<Role, string>;
  beforeAll(async () => {
    sut = await startTestApp();
    tokens.owner = await sut.signIn(DEMO.owner);
    tokens.foreman = await sut.signIn(DEMO.foreman);
    tokens.advisor = await sut.signIn(DEMO.advisor);
    tokens.technician = (await sut.badge('1044')).accessToken;
    const pairing = await sut
      .http()
      .post('/api/screens')
      .auth(tokens.owner, { type: 'bearer' })
      .send({ name: 'Test wall' });
    const paired = await sut.http().post('/api/auth/screens/pair').send({ code: pairing.body.code });
    tokens.display = paired.body.accessToken;
  });
  afterAll(() => sut.close());

  it.each(ROUTES)('%s %s answers 401 without a token', async (method, path) => {
    await sut.http()[method](path).expect(401);
  });

  it.each(ROUTES)('%s %s answers 403 to every role not allowed', async (method, path, allowed) => {
    for (const role of ALL.filter((r) => !allowed.includes(r))) {
      const response = await sut.http()[method](path).auth(tokens[role], { type: 'bearer' }).send({});
      expect(response.status, `${role} on ${method} ${path}`).toBe(403);
      expect(response.body.message).toBe(ROLE_REFUSAL);
    }
  });

  it.each(ROUTES)('%s %s lets the allowed roles past the guard', async (method, path, allowed) => {
    for (const role of allowed) {
      const response = await sut.http()[method](path).auth(tokens[role], { type: 'bearer' }).send({});
      expect(response.status, `${role} on ${method} ${path}`).not.toBe(401);
      expect(response.body.message, `${role} on ${method} ${path}`).not.toBe(ROLE_REFUSAL);
      expect(response.status).toBeLessThan(500);
    }
  });
});
