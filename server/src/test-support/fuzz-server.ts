import { SchedulerRegistry } from '@nestjs/schedule';
import { SQLITE, type Sqlite } from '../db/database.js';
import { MailboxService } from '../mail/mailbox.service.js';
import { OutboxService } from '../mail/outbox.service.js';
import { TimersService } from '../timers/timers.service.js';
import { WebhookDeliverer } from '../webhooks/webhook-deliverer.service.js';
import { readPools, type CallerIds } from './fuzz-requests.js';
import type { Method } from './routes.js';
import { rowsWritten, tableDigests } from './table-digests.js';
import { DEMO, startTestApp } from './test-app.js';

/**
 * The demo server the API fuzz (`common/abuse.spec.ts`) runs in a process of its own
 * (`startServerProcess`), and what the fuzz asks of it besides requests.
 */
const fuzzServer = async () => {
  const sut = await startTestApp();
  const sqlite = sut.app.get<Sqlite>(SQLITE);
  // The fuzz runs the fixed-wait ticker itself, between requests, so that what it writes is never
  // taken for a refused request's doing; mail is sent at the same points. Webhooks are not sent.
  const scheduler = sut.app.get(SchedulerRegistry);
  for (const name of scheduler.getIntervals()) scheduler.deleteInterval(name);
  await sut.app.get(WebhookDeliverer).onModuleDestroy();
  const timers = sut.app.get(TimersService);
  const mail = sut.app.get(OutboxService);
  const mailbox = sut.app.get(MailboxService);
  const queuedMail = sqlite.connection.prepare("select 1 from mail_outbox where status = 'queued' limit 1");
  const express = sut.app.getHttpAdapter().getInstance() as {
    router: { stack: { route?: { path: string; methods: Record<string, boolean> } }[] };
  };
  return {
    ready: { url: sut.url, dbFile: sut.config.dbFile, dataDir: sut.config.dataDir },
    handlers: {
      signIn: (who: 'owner' | 'foreman' | 'advisor') => sut.signIn(DEMO[who]),
      badge: (badge: string) => sut.badge(badge),
      /** A kiosk tablet paired as Admin and the tablet pair one: its id in `screens` and its device token. */
      pairKiosk: async () => {
        const owner = await sut.signIn(DEMO.owner);
        const pairing = await sut
          .http()
          .post('/api/kiosks')
          .auth(owner, { type: 'bearer' })
          .send({ name: 'Fuzz kiosk' })
          .expect(201);
        const paired = await sut
          .http()
          .post('/api/auth/kiosks/pair')
          .send({ code: pairing.body.code })
          .expect(200);
        return { id: pairing.body.id as number, accessToken: paired.body.accessToken as string };
      },
      /** Every route the server serves, as Express lists it. */
      routes: () =>
        express.router.stack.flatMap(({ route }) =>
          route
            ? (
                Object.keys(route.methods).filter((m) =>
                  ['get', 'post', 'patch', 'delete'].includes(m),
                ) as Method[]
              ).map((method): [Method, string] => [method, route.path])
            : [],
        ),
      rowsWritten: () => rowsWritten(sut.app),
      tableDigests: (except: string[]) => tableDigests(sut.app, except),
      pools: (callers: CallerIds) =>
        readPools(
          sqlite,
          callers,
          mailbox.list({ limit: 20, cursor: undefined }).items.map((entry) => entry.id),
        ),
      /** What the server does on its own between requests: fixed waits that are up, and mail to send. */
      settle: async () => {
        timers.markEndedHolds();
        if (queuedMail.get()) await mail.flush();
      },
    },
    close: () => sut.close(),
  };
};
export default fuzzServer;
export type FuzzServer = typeof fuzzServer;
