import type { INestApplication } from '@nestjs/common';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents, SignInAnswer } from '@baytime/shared';
import { createApp } from '../app.js';
import { loadConfig, type AppConfig } from '../config/app-config.js';
import { DEMO_PASSWORD, DEMO_PIN } from '../demo/demo-shop.js';

export type LiveClient = Socket<ServerToClientEvents, ClientToServerEvents>;

export interface TestApp {
  app: INestApplication;
  config: AppConfig;
  url: string;
  http: () => ReturnType<typeof request>;
  signIn: (email: string) => Promise<string>;
  badge: (badge: string) => Promise<SignInAnswer>;
  /** Posts a punch with a fresh id as the technician whose token it is; the test expects the answer. */
  punch: (token: string, body: Record<string, unknown>) => request.Test;
  connect: (token: string) => LiveClient;
  close: () => Promise<void>;
}

export const DEMO = {
  owner: 'owner@marlowcreek.test',
  foreman: 'foreman@marlowcreek.test',
  advisor: 'advisor@marlowcreek.test',
  badges: ['1041', '1042', '1043', '1044', '1045', '1046'],
} as const;

/** The real server on a temporary SQLite file and a free port, seeded with the demo shop. */
export async function startTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const dataDir = mkdtempSync(join(tmpdir(), 'baytime-test-'));
  const config = loadConfig({ BAYTIME_DATA_DIR: dataDir, BAYTIME_DEMO: '1', PORT: '0', ...env });
  const app = await createApp(config, false);
  await app.listen(0, '127.0.0.1');
  const url = (await app.getUrl()).replace('[::1]', '127.0.0.1');
  const sockets: LiveClient[] = [];
  // Through the returned object, so a test can serve the same database again from a new app.
  const http = () => request(testApp.app.getHttpServer());
  const testApp: TestApp = {
    app,
    config,
    url,
    http,
    signIn: async (email) => {
      const response = await http()
        .post('/api/auth/login')
        .send({ email, password: DEMO_PASSWORD })
        .expect(200);
      return (response.body as SignInAnswer).accessToken;
    },
    badge: async (badge) => {
      const response = await http().post('/api/auth/badge').send({ badge, pin: DEMO_PIN }).expect(200);
      return response.body as SignInAnswer;
    },
    punch: (token, body) =>
      http()
        .post('/api/punches')
        .auth(token, { type: 'bearer' })
        .send({ id: randomUUID(), ...body }),
    connect: (token) => {
      const socket: LiveClient = io(url, { auth: { token }, transports: ['websocket'], reconnection: false });
      sockets.push(socket);
      return socket;
    },
    close: async () => {
      for (const socket of sockets) socket.disconnect();
      await testApp.app.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
  return testApp;
}

/** Resolves with the first event of that name that passes `match`, or rejects after `timeoutMs`. */
export function nextEvent<E extends keyof ServerToClientEvents>(
  socket: LiveClient,
  event: E,
  match: (payload: Parameters<ServerToClientEvents[E]>[0]) => boolean = () => true,
  timeoutMs = 2000,
): Promise<Parameters<ServerToClientEvents[E]>[0]> {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`No ${event} within ${timeoutMs} ms`)), timeoutMs);
    const listener = (payload: Parameters<ServerToClientEvents[E]>[0]) => {
      if (!match(payload)) return;
      clearTimeout(timer);
      (socket.off as (e: string, l: unknown) => void)(event, listener);
      resolve(payload);
    };
    (socket.on as (e: string, l: unknown) => void)(event, listener);
  });
}
