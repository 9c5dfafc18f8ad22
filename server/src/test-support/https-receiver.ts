import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:https';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { generate } from 'selfsigned';

export interface ReceivedHook {
  headers: Record<string, string | string[] | undefined>;
  body: string;
}

export interface HttpsReceiver {
  /** `https://localhost:<port>/hooks`. */
  url: string;
  /** The receiver's own self-signed certificate: give it to the server as BAYTIME_WEBHOOK_CA_FILE. */
  caFile: string;
  received: ReceivedHook[];
  /** The statuses to answer, in order; 204 once they run out. */
  answers: number[];
  /** Runs before a delivery is answered, while the sender still waits for the answer. */
  beforeAnswer: ((hook: ReceivedHook) => Promise<void>) | null;
  /** Resolves with the first delivery, received or to come, that passes `match`; rejects after `timeoutMs`. */
  next: (match?: (hook: ReceivedHook) => boolean, timeoutMs?: number) => Promise<ReceivedHook>;
  close: () => Promise<void>;
}

/** A webhook receiver over HTTPS on this machine, with a certificate made for this test run. */
export async function startHttpsReceiver(): Promise<HttpsReceiver> {
  const pems = await generate([{ name: 'commonName', value: 'localhost' }], {
    keySize: 2048,
    algorithm: 'sha256',
    extensions: [
      {
        name: 'subjectAltName',
        altNames: [
          { type: 2, value: 'localhost' },
          { type: 7, ip: '127.0.0.1' },
        ],
      },
    ],
  });
  const dir = mkdtempSync(join(tmpdir(), 'baytime-receiver-'));
  const caFile = join(dir, 'receiver-ca.pem');
  writeFileSync(caFile, pems.cert);
  const received: ReceivedHook[] = [];
  const waiting: (() => void)[] = [];
  const answers: number[] = [];
  const server = createServer({ key: pems.private, cert: pems.cert }, (request, response) => {
    const chunks: Buffer[] = [];
    request.on('data', (chunk: Buffer) => chunks.push(chunk));
    request.on('end', () => {
      const hook = { headers: request.headers, body: Buffer.concat(chunks).toString('utf8') };
      received.push(hook);
      void Promise.resolve(receiver.beforeAnswer?.(hook)).then(() => {
        response.writeHead(answers.shift() ?? 204).end();
        for (const wake of waiting.splice(0)) wake();
      });
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  const next = (match: (hook: ReceivedHook) => boolean = () => true, timeoutMs = 5000) =>
    new Promise<ReceivedHook>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`No webhook within ${timeoutMs} ms`)), timeoutMs);
      const look = () => {
        const hook = received.find(match);
        if (hook) {
          clearTimeout(timer);
          resolve(hook);
        } else waiting.push(look);
      };
      look();
    });
  const receiver: HttpsReceiver = {
    url: `https://localhost:${port}/hooks`,
    caFile,
    received,
    answers,
    beforeAnswer: null,
    next,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      rmSync(dir, { recursive: true, force: true });
    },
  };
  return receiver;
}
