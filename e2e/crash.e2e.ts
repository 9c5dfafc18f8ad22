import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MyDay, SignInAnswer, Timecard } from '@baytime/shared';
import { startServer, type RunningServer } from './support/server.js';

/**
 * kill -9 during a burst of punches: every punch the server acknowledged (201) is in the database
 * exactly once after a restart, and replaying every punch the tablets sent adds nothing twice.
 * A kill -9 leaves written pages in the operating system's cache, so this would pass with
 * synchronous=OFF as well: that an answered punch was synced to disk is checked by
 * server/src/db/durability.spec.ts (the pragmas, and the answer written only after the commit).
 */
describe('crash during a burst of punches', () => {
  let server: RunningServer;
  beforeAll(async () => {
    server = await startServer();
  });
  afterAll(() => server?.stop());

  const api = async <T>(
    path: string,
    token: string | null,
    body?: unknown,
  ): Promise<{ status: number; body: T }> => {
    const response = await fetch(`${server.url}/api${path}`, {
      method: body === undefined ? 'GET' : 'POST',
      headers: { 'content-type': 'application/json', ...(token ? { authorization: `Bearer ${token}` } : {}) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    return { status: response.status, body: (await response.json().catch(() => null)) as T };
  };

  it('loses no acknowledged punch and counts none twice', async () => {
    const techs = await Promise.all(
      ['1041', '1042', '1043', '1044', '1045', '1046'].map(
        async (badge) => (await api<SignInAnswer>('/auth/badge', null, { badge, pin: '4321' })).body,
      ),
    );
    const acknowledged = new Map<string, number>();
    const sent: { id: string; kind: string; token: string; at: string }[] = [];
    let crashed = false;

    // One sequential stream per technician: break on and off, the way a kiosk would punch.
    const streams = techs.map(async (tech) => {
      const day = (await api<MyDay>('/me/day', tech.accessToken)).body;
      let onBreak = day.shift.status === 'on-break';
      if (day.shift.status === 'off') {
        await api('/punches', tech.accessToken, { id: randomUUID(), kind: 'shift-in' });
      }
      while (!crashed) {
        const punch = {
          id: randomUUID(),
          kind: onBreak ? 'break-end' : 'break-start',
          at: new Date().toISOString(),
        };
        sent.push({ ...punch, token: tech.accessToken });
        try {
          const { status } = await api('/punches', tech.accessToken, punch);
          if (status === 201) acknowledged.set(punch.id, tech.user.id);
          onBreak = !onBreak;
        } catch {
          return;
        }
      }
    });
    // Crash mid-burst: once a good number of punches were answered, whatever the machine's speed.
    for (let waited = 0; acknowledged.size < 24 && waited < 20_000; waited += 20)
      await new Promise((r) => setTimeout(r, 20));
    crashed = true;
    await server.kill('SIGKILL');
    await Promise.allSettled(streams);
    expect(acknowledged.size).toBeGreaterThan(10);

    await server.restart();
    const owner = (
      await api<SignInAnswer>('/auth/login', null, {
        email: 'owner@marlowcreek.test',
        password: 'baytime-demo',
      })
    ).body;
    const stored = async () => {
      const ids: string[] = [];
      for (const tech of techs) {
        const card = (await api<Timecard>(`/timecards?technicianId=${tech.user.id}`, owner.accessToken)).body;
        ids.push(...card.punches.map((p) => p.id));
      }
      return ids;
    };
    const afterCrash = await stored();
    for (const id of acknowledged.keys())
      expect(afterCrash.filter((stored) => stored === id)).toHaveLength(1);

    // The tablets' outboxes replay everything they sent: known ids answer 200 and change nothing.
    for (const punch of sent) {
      const { status } = await api('/punches', punch.token, { id: punch.id, kind: punch.kind, at: punch.at });
      expect([200, 201, 409]).toContain(status);
      if (acknowledged.has(punch.id)) expect(status).toBe(200);
    }
    const afterReplay = await stored();
    expect(new Set(afterReplay).size).toBe(afterReplay.length);
    for (const id of acknowledged.keys()) expect(afterReplay).toContain(id);
  });
});
