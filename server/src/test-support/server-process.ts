import { spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/**
 * Runs a test-support module in a child process and calls its handlers over IPC. The server and
 * better-sqlite3 are synchronous: a request that loops forever in the test's own process freezes the
 * test with it, while a child's hang is seen from here and the child killed. The child loads the
 * TypeScript source through the specs' own Vite transform (`host-child.mjs`), not `server/dist`: the
 * server project's specs run without a build (`npm run test:unit`), where `dist` may be stale or absent.
 */

type Handlers = Record<string, (arg: never) => unknown>;

/** What the child module exports by default: it starts, then answers calls to its handlers. */
export type Hosted<R = unknown, H extends Handlers = Handlers> = () => Promise<{
  ready: R;
  handlers: H;
  close: () => Promise<void>;
}>;

interface Call {
  id: number;
  /** `null` closes the child. */
  op: string | null;
  arg?: unknown;
}
type Reply = { ready: unknown } | { id: number; result?: unknown; error?: string };

/** In the child: starts the module and answers the parent's calls until told to close. */
export async function hostChild(modulePath: string): Promise<void> {
  const send = (message: Reply, then?: () => void) => process.send!(message, undefined, {}, then);
  // An orphan would otherwise hold its port and temp dir for good.
  process.on('disconnect', () => process.exit(1));
  const { ready, handlers, close } = await ((await import(modulePath)) as { default: Hosted }).default();
  process.on('message', async ({ id, op, arg }: Call) => {
    try {
      if (op === null) {
        await close();
        send({ id }, () => process.exit(0));
      } else send({ id, result: await handlers[op]!(arg as never) });
    } catch (error) {
      send({ id, error: error instanceof Error ? (error.stack ?? error.message) : String(error) });
    }
  });
  send({ ready });
}

/** Thrown once the child has hung or died: everything after it fails with the same reason. */
export class ServerGone extends Error {}

export interface ServerProcess<R, H extends Handlers> {
  ready: R;
  /** Calls a handler in the child, within the deadline. */
  call<K extends keyof H & string>(op: K, ...arg: Parameters<H[K]>): Promise<Awaited<ReturnType<H[K]>>>;
  /** Awaits `work` (a request to the child, say); past the deadline, kills the child and names `what`. */
  within<T>(work: Promise<T>, what: string): Promise<T>;
  /** Set once the child has hung or died. */
  gone: () => ServerGone | undefined;
  /** Closes the child's module, or kills the child if it does not close within the deadline. */
  stop: () => Promise<void>;
}

const LOG_CHARS = 4_000;

export async function startServerProcess<M extends Hosted<unknown, Handlers>>(
  module: URL,
  { deadlineMs, startMs = 60_000 }: { deadlineMs: number; startMs?: number },
): Promise<ServerProcess<Awaited<ReturnType<M>>['ready'], Awaited<ReturnType<M>>['handlers']>> {
  type Started = Awaited<ReturnType<M>>;
  const child = spawn(
    process.execPath,
    [fileURLToPath(new URL('./host-child.mjs', import.meta.url)), fileURLToPath(module)],
    { cwd: fileURLToPath(new URL('../../../', import.meta.url)), stdio: ['ignore', 'pipe', 'pipe', 'ipc'] },
  );
  // The test's process may end without `stop`: a hung child would outlive it.
  const killOnExit = () => child.kill('SIGKILL');
  process.once('exit', killOnExit);
  let output = '';
  const keep = (chunk: Buffer) => (output = (output + chunk.toString()).slice(-LOG_CHARS));
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);

  let gone: ServerGone | undefined;
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const pending = new Map<number, { resolve: (value: unknown) => void; reject: (error: Error) => void }>();
  const end = (reason: string) => {
    const tail = output.trim();
    gone ??= new ServerGone(tail ? `${reason}\n--- the server's last output ---\n${tail}` : reason);
    for (const { reject } of pending.values()) reject(gone);
    pending.clear();
  };
  child.once('exit', (code, signal) => end(`The server process exited (${signal ?? `code ${code}`}).`));
  const kill = (reason: string) => {
    end(reason);
    child.kill('SIGKILL');
    return exited;
  };

  const deadline = <T>(work: Promise<T>, ms: number, what: string): Promise<T> => {
    if (gone) {
      work.catch(() => undefined);
      return Promise.reject(gone);
    }
    let timer: NodeJS.Timeout | undefined;
    const late = new Promise<never>((_, reject) => {
      timer = setTimeout(() => {
        void kill(`No answer within ${ms} ms, so the server process was killed: ${what}`);
        // Before the kill closes `work`'s connection, which would fail it with a less telling error.
        reject(gone);
      }, ms);
    });
    return Promise.race([work, late])
      .catch((error: unknown) => {
        throw gone ?? error;
      })
      .finally(() => clearTimeout(timer));
  };

  let ids = 0;
  const ask = (op: string | null, arg?: unknown) =>
    new Promise<unknown>((resolve, reject) => {
      if (gone) return reject(gone);
      const id = ++ids;
      pending.set(id, { resolve, reject });
      child.send({ id, op, arg } satisfies Call);
    });
  child.on('message', (reply: Reply) => {
    if ('ready' in reply) return;
    const call = pending.get(reply.id);
    pending.delete(reply.id);
    if (reply.error === undefined) call?.resolve(reply.result);
    else call?.reject(new Error(`The server's handler failed: ${reply.error}`));
  });

  const ready = await deadline(
    new Promise<Started['ready']>((resolve, reject) => {
      child.on('message', (reply: Reply) => 'ready' in reply && resolve(reply.ready as Started['ready']));
      child.once('exit', () => reject(gone));
    }),
    startMs,
    'starting',
  );
  return {
    ready,
    call: (op, ...arg) => deadline(ask(op, arg[0]), deadlineMs, `the server's ${op}`) as never,
    within: (work, what) => deadline(work, deadlineMs, what),
    gone: () => gone,
    stop: async () => {
      if (!gone) await deadline(ask(null), deadlineMs, 'closing').catch(() => undefined);
      await kill('Stopped.');
      process.off('exit', killOnExit);
    },
  };
}
