import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@baytime/shared';
import { ALL_ROLES as ALL, ROUTES } from '../test-support/routes.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { ROLE_REFUSAL, SignedInGuard } from './guards/auth.guard.js';

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
    const kiosk = await sut
      .http()
      .post('/api/kiosks')
      .auth(tokens.owner, { type: 'bearer' })
      .send({ name: 'Test kiosk' });
    tokens.kiosk = (
      await sut.http().post('/api/auth/kiosks/pair').send({ code: kiosk.body.code })
    ).body.accessToken;
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
