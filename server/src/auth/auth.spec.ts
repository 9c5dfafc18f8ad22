import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { CreatedIntegrationKey } from '@baytime/shared';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { AuthService } from './auth.service.js';

describe(AuthService.name, () => {
  let sut: TestApp;
  beforeAll(async () => {
    sut = await startTestApp({
      BAYTIME_ADMIN_EMAIL: 'boss@example.test',
      BAYTIME_ADMIN_PASSWORD: 'a-long-secret-1',
    });
  });
  afterAll(() => sut.close());

  it('signs office staff in with e-mail and password and never returns a secret', async () => {
    const { body } = await sut
      .http()
      .post('/api/auth/login')
      .send({ email: DEMO.foreman, password: 'baytime-demo' })
      .expect(200);
    expect(body.user).toEqual({ id: expect.any(Number), name: 'Theo Varga', role: 'foreman' });
    const me = await sut.http().get('/api/me').auth(body.accessToken, { type: 'bearer' }).expect(200);
    expect(me.body).toEqual(body.user);
    expect(JSON.stringify(me.body)).not.toMatch(/hash|scrypt/);
  });

  it('refuses a wrong password with 401 and a bad body with 400 and field paths', async () => {
    await sut.http().post('/api/auth/login').send({ email: DEMO.owner, password: 'nope' }).expect(401);
    const { body } = await sut.http().post('/api/auth/login').send({ email: 'not-an-email' }).expect(400);
    expect(body.issues.map((issue: { path: string[] }) => issue.path[0])).toEqual(['email', 'password']);
  });

  it('bootstraps the owner from BAYTIME_ADMIN_EMAIL and BAYTIME_ADMIN_PASSWORD', async () => {
    const { body } = await sut
      .http()
      .post('/api/auth/login')
      .send({ email: 'boss@example.test', password: 'a-long-secret-1' })
      .expect(200);
    expect(body.user.role).toBe('owner');
  });

  it('signs a technician in with badge and PIN, and locks the badge after repeated wrong PINs', async () => {
    const { user } = await sut.badge('1042');
    expect(user.role).toBe('technician');
    for (let i = 0; i < 5; i++)
      await sut.http().post('/api/auth/badge').send({ badge: '1046', pin: '0000' }).expect(401);
    await sut.http().post('/api/auth/badge').send({ badge: '1046', pin: '4321' }).expect(429);
    await sut.badge('1045');
  });

  it('pairs a wall screen once with a one-time code; the display token reads but cannot write', async () => {
    const owner = await sut.signIn(DEMO.owner);
    const { body: pairing } = await sut
      .http()
      .post('/api/screens')
      .auth(owner, { type: 'bearer' })
      .send({ name: 'Back wall' })
      .expect(201);
    const { body } = await sut
      .http()
      .post('/api/auth/screens/pair')
      .send({ code: pairing.code.toLowerCase() })
      .expect(200);
    await sut.http().post('/api/auth/screens/pair').send({ code: pairing.code }).expect(401);
    await sut.http().get('/api/board').auth(body.accessToken, { type: 'bearer' }).expect(200);
    await sut
      .http()
      .post('/api/bays')
      .auth(body.accessToken, { type: 'bearer' })
      .send({ name: 'Bay 99' })
      .expect(403);

    await sut.http().delete(`/api/screens/${pairing.id}`).auth(owner, { type: 'bearer' }).expect(200);
    await sut.http().get('/api/board').auth(body.accessToken, { type: 'bearer' }).expect(401);
  });

  it('refuses forged and expired tokens', async () => {
    const forged = new JwtService({ secret: 'not-the-secret' }).sign({ sub: 1, role: 'owner' });
    await sut.http().get('/api/me').auth(forged, { type: 'bearer' }).expect(401);
    const expired = new JwtService({ secret: sut.config.jwtSecret }).sign(
      { sub: 1, role: 'owner' },
      { expiresIn: -10 },
    );
    await sut.http().get('/api/me').auth(expired, { type: 'bearer' }).expect(401);
  });

  it('checks expiry and signature on every use of a token it has accepted before', async () => {
    const auth = sut.app.get(AuthService);
    const token = new JwtService({ secret: sut.config.jwtSecret }).sign(
      { sub: 1, role: 'owner' },
      { expiresIn: 60 },
    );
    expect(auth.check(token)).toHaveProperty('principal.id', 1);
    expect(auth.check(token, Date.now() + 61_000)).toEqual({ refusal: 'token-expired' });
    const [header, body, signature] = token.split('.') as [string, string, string];
    const tampered = `${header}.${body}.${signature.slice(0, 10)}${signature[10] === 'A' ? 'B' : 'A'}${signature.slice(11)}`;
    expect(auth.check(tampered)).toEqual({ refusal: 'token-invalid' });
    expect(auth.check(token)).toHaveProperty('principal.id', 1);
  });

  it('reads a Bearer token in any case of the scheme, and refuses others with a bare 401', async () => {
    const owner = await sut.signIn(DEMO.owner);
    await sut.http().get('/api/me').set('authorization', `bearer ${owner}`).expect(200);
    const signedWith = (options: ConstructorParameters<typeof JwtService>[0]) =>
      new JwtService({ secret: sut.config.jwtSecret, ...options }).sign({ sub: 1, role: 'owner' });
    const refused = [
      `Basic ${owner}`,
      owner,
      `Bearer ${signedWith({ signOptions: { algorithm: 'HS512', expiresIn: '1h' } })}`,
      `Bearer ${signedWith({})}`,
      `Bearer ${signedWith({ signOptions: { expiresIn: '1h', notBefore: '1h' } })}`,
    ];
    for (const authorization of refused) {
      const { body } = await sut.http().get('/api/me').set('authorization', authorization).expect(401);
      expect(body).toEqual({ message: 'Unauthorized', statusCode: 401 });
    }
  });

  describe('renewing an office sign-in', () => {
    const HOUR_S = 3600;
    const nowS = () => Math.floor(Date.now() / 1000);
    const claims = (token: string) =>
      new JwtService({}).decode<{ sub: number; role: string; exp: number; signedInAt?: number }>(token);
    /** An owner's token as the server signs them, signed in `ago` seconds back and running `left` more. */
    const ownerToken = (ago: number, left: number, signedIn = true) =>
      new JwtService({ secret: sut.config.jwtSecret }).sign(
        { sub: 1, role: 'owner', ...(signedIn && { signedInAt: nowS() - ago }) },
        { expiresIn: left },
      );
    const renew = (token: string) => sut.http().post('/api/auth/renew').auth(token, { type: 'bearer' });

    it('answers a token of the full 12 hours for the same person, kept from the same sign-in', async () => {
      const old = ownerToken(9 * HOUR_S, 3 * HOUR_S);
      const { body } = await renew(old).expect(200);
      expect(body.user).toEqual({ id: 1, name: expect.any(String), role: 'owner' });
      const renewed = claims(body.accessToken);
      expect(renewed.exp).toBeGreaterThan(claims(old).exp + 8 * HOUR_S);
      expect(renewed.exp - nowS()).toBeGreaterThan(12 * HOUR_S - 60);
      expect(renewed.signedInAt).toBe(claims(old).signedInAt);
      const me = await sut.http().get('/api/me').auth(body.accessToken, { type: 'bearer' }).expect(200);
      expect(me.body).toEqual(body.user);

      const signedIn = await sut.signIn(DEMO.advisor);
      const again = await renew(signedIn).expect(200);
      expect(again.body.user.role).toBe('advisor');
    });

    it('says in the sign-in and every renewal until when the sign-in is renewed', async () => {
      const { body: signedIn } = await sut
        .http()
        .post('/api/auth/login')
        .send({ email: DEMO.foreman, password: 'baytime-demo' })
        .expect(200);
      const { signedInAt } = claims(signedIn.accessToken);
      expect(signedIn.renewableUntil).toBe(new Date((signedInAt! + 12 * HOUR_S) * 1000).toISOString());
      const { body: renewed } = await renew(signedIn.accessToken).expect(200);
      expect(renewed.renewableUntil).toBe(signedIn.renewableUntil);

      const old = ownerToken(9 * HOUR_S, 3 * HOUR_S);
      const { body } = await renew(old).expect(200);
      expect(body.renewableUntil).toBe(
        new Date((claims(old).signedInAt! + 12 * HOUR_S) * 1000).toISOString(),
      );
      // Only added: the answers keep their token and user, and a kiosk's sign-in is never renewed.
      expect(Object.keys(body).sort()).toEqual(['accessToken', 'renewableUntil', 'user']);
      expect(await sut.badge('1044')).not.toHaveProperty('renewableUntil');
    });

    it('stops renewing 12 hours after the password was given', async () => {
      await renew(ownerToken(12 * HOUR_S - 60, HOUR_S)).expect(200);
      const { body } = await renew(ownerToken(12 * HOUR_S + 60, HOUR_S)).expect(403);
      expect(body.message).toMatch(/can no longer be renewed/);
      // A token signed before sign-ins carried their time cannot say how old the sign-in is.
      await renew(ownerToken(0, HOUR_S, false)).expect(403);
    });

    it('refuses wall screens, kiosks, technicians and integration keys', async () => {
      const owner = await sut.signIn(DEMO.owner);
      const paired = async (devices: 'screens' | 'kiosks') => {
        const { body } = await sut
          .http()
          .post(`/api/${devices}`)
          .auth(owner, { type: 'bearer' })
          .send({ name: `Renewal ${devices}` })
          .expect(201);
        const pairing = await sut.http().post(`/api/auth/${devices}/pair`).send({ code: body.code });
        return pairing.body.accessToken as string;
      };
      const key = (
        await sut
          .http()
          .post('/api/integration-keys')
          .auth(owner, { type: 'bearer' })
          .send({ name: 'Renewal system', scopes: ['reports:read'] })
          .expect(201)
      ).body as CreatedIntegrationKey;
      const technician = (await sut.badge('1043')).accessToken;
      for (const token of [await paired('screens'), await paired('kiosks'), key.secret, technician])
        await renew(token).expect(403);
    });

    it('refuses an expired token, a deactivated person and a changed role with 401', async () => {
      const expired = ownerToken(13 * HOUR_S, -10);
      await renew(expired).expect(401);
      expect(() => sut.app.get(AuthService).renew(expired)).toThrow(UnauthorizedException);
      const owner = await sut.signIn(DEMO.owner);
      const person = async (email: string) => {
        const { body: user } = await sut
          .http()
          .post('/api/users')
          .auth(owner, { type: 'bearer' })
          .send({ name: 'Ada Counter', role: 'advisor', email, password: 'a-long-secret-2' })
          .expect(201);
        const { body } = await sut
          .http()
          .post('/api/auth/login')
          .send({ email, password: 'a-long-secret-2' })
          .expect(200);
        return { id: user.id as number, token: body.accessToken as string };
      };
      const leaving = await person('leaving@example.test');
      const moving = await person('moving@example.test');
      await sut
        .http()
        .patch(`/api/users/${leaving.id}`)
        .auth(owner, { type: 'bearer' })
        .send({ active: false })
        .expect(200);
      await sut
        .http()
        .patch(`/api/users/${moving.id}`)
        .auth(owner, { type: 'bearer' })
        .send({ role: 'foreman' })
        .expect(200);
      await renew(leaving.token).expect(401);
      await renew(moving.token).expect(401);
    });
  });

  it('does not let an owner lock themself out', async () => {
    const owner = await sut.signIn(DEMO.owner);
    const me = (await sut.http().get('/api/me').auth(owner, { type: 'bearer' }).expect(200)).body as {
      id: number;
    };
    const { body } = await sut
      .http()
      .patch(`/api/users/${me.id}`)
      .auth(owner, { type: 'bearer' })
      .send({ active: false })
      .expect(409);
    expect(body.message).toMatch(/cannot deactivate your own account/);
    await sut.http().get('/api/me').auth(owner, { type: 'bearer' }).expect(200);
  });

  it('ends every sign-in made before a password or PIN changed, on the live link too', async () => {
    const owner = await sut.signIn(DEMO.owner);
    const me = (token: string) => sut.http().get('/api/me').auth(token, { type: 'bearer' });
    const change = (id: number, body: object) =>
      sut.http().patch(`/api/users/${id}`).auth(owner, { type: 'bearer' }).send(body).expect(200);
    const advisor = await sut.signIn(DEMO.advisor);
    const advisorId = ((await me(advisor).expect(200)).body as { id: number }).id;
    const socket = sut.connect(advisor);
    await nextEvent(socket, 'board.snapshot');
    const ended = nextEvent(socket, 'session.ended');
    // Marcus: badge 1044 (1046 is locked by a test above).
    const marcus = await sut.badge('1044');
    // A token knows its time to the second: the change comes in a later one.
    await new Promise((resolve) => setTimeout(resolve, 1100));

    await change(advisorId, { password: 'a-fresh-secret-9' });
    expect((await ended).reason).toBe('credentials-changed');
    await me(advisor).expect(401);
    const again = await sut
      .http()
      .post('/api/auth/login')
      .send({ email: DEMO.advisor, password: 'a-fresh-secret-9' })
      .expect(200);
    await me(again.body.accessToken as string).expect(200);

    await change(marcus.user.id, { pin: '9753' });
    await me(marcus.accessToken).expect(401);
    await sut.http().post('/api/auth/badge').send({ badge: '1044', pin: '9753' }).expect(200);
    // Any other change leaves sign-ins as they are.
    await change(advisorId, { name: 'Nell Ashby-Crane' });
    await me(again.body.accessToken as string).expect(200);
  });

  it('answers health without a token', async () => {
    const { body } = await sut.http().get('/api/health').expect(200);
    expect(body).toEqual({ ok: true, version: expect.any(String) });
  });
});
