import { randomUUID } from 'node:crypto';
import { io, type Socket } from 'socket.io-client';
import type { BoardPerson, PunchKind, ServerToClientEvents } from '@baytime/shared';
import { LIVE_SOCKET_OPTIONS } from '@baytime/shared/client';
import type { EventLoopDelay } from '../health/event-loop.service.js';
import type { ServerProcess } from './server-process.js';
import type { FloorState, ShiftNow } from './synthetic-year.js';

type LiveClient = Socket<ServerToClientEvents>;

/**
 * The public live contract: the token in the handshake's `auth`, a `board.snapshot` on every
 * connection. Socket.IO's own reconnection with the apps' policy, over WebSocket only: the apps fall
 * back to long polling where a WebSocket cannot open, and on this one machine the bench's thousand
 * clients trying that while the server restarts take the cores it needs to start.
 */
export function connect(url: string, token: string): LiveClient {
  const socket: LiveClient = io(url, {
    auth: { token },
    forceNew: true,
    ...LIVE_SOCKET_OPTIONS,
    transports: ['websocket'],
    tryAllTransports: false,
  });
  // A server that shut down cleanly says so; the apps connect again, as after a crash.
  socket.on('disconnect', (reason) => {
    if (reason === 'io server disconnect') socket.connect();
  });
  return socket;
}

/** Resolves once every socket has had a `board.snapshot` after this call; answers when the last came. */
export function allSnapshots(sockets: LiveClient[], timeoutMs: number): Promise<number> {
  return new Promise((resolve, reject) => {
    let waiting = sockets.length;
    const timer = setTimeout(
      () => reject(new Error(`${waiting} of ${sockets.length} sockets had no snapshot in ${timeoutMs} ms`)),
      timeoutMs,
    );
    for (const socket of sockets)
      socket.once('board.snapshot', () => {
        if (--waiting > 0) return;
        clearTimeout(timer);
        resolve(performance.now());
      });
  });
}

/** Each technician's next punches from where they stand, and what the boards then show them as. */
const CYCLES: Record<FloorState, PunchKind[]> = {
  'on-job': ['job-off', 'break-start', 'break-end', 'job-on'],
  'on-break': ['break-end', 'job-on', 'job-off', 'break-start'],
  idle: ['job-on', 'job-off', 'break-start', 'break-end'],
};
const SHOWN_AS: Partial<Record<PunchKind, BoardPerson['status']>> = {
  'job-on': 'on-job',
  'job-off': 'idle',
  'break-start': 'on-break',
  'break-end': 'idle',
};

export interface LoadResult {
  sent: number;
  refused: number;
  /** Punch sent → board shows it, one sample per punch and board, in ms. */
  latencies: number[];
  /** Deliveries that never came before the technician's next punch or the end. */
  missed: number;
  elapsedMs: number;
  serverCpuMs: number;
  /** Of which in the kernel on the server's behalf. */
  serverSystemCpuMs: number;
  /** Of which on the server's main thread, the event loop; the rest is V8's collector and libuv's pool. */
  serverMainThreadCpuMs: number;
  eventLoop: EventLoopDelay;
  /** The server's resident memory once a second through the load, in MB: it rises and falls with V8's collector. */
  rssSamplesMb: number[];
}

/**
 * Kiosks post `rate` punches a second for `seconds`, round the technicians on shift, each punch
 * changing how the boards show its technician. A punch's latency at a board is the time from sending
 * it to the first `floor.updated` there that shows the change (the `bay.updated` of the same change
 * goes out just before it, in the same tick).
 */
export async function punchLoad(
  server: ServerProcess,
  boards: LiveClient[],
  shift: (ShiftNow & { token: string })[],
  { rate, seconds }: { rate: number; seconds: number },
): Promise<LoadResult> {
  const pending = new Map<number, { sentAt: number; shownAs: BoardPerson['status']; seenBy: Set<number> }>();
  const latencies: number[] = [];
  let missed = 0;
  boards.forEach((board, boardNo) =>
    board.on('floor.updated', ({ people }) => {
      const receivedAt = performance.now();
      const status = new Map(people.map((person) => [person.id, person.status]));
      for (const [technicianId, punch] of pending)
        if (!punch.seenBy.has(boardNo) && status.get(technicianId) === punch.shownAs) {
          punch.seenBy.add(boardNo);
          latencies.push(receivedAt - punch.sentAt);
        }
    }),
  );
  const settle = (technicianId: number) => {
    const previous = pending.get(technicianId);
    if (previous) missed += boards.length - previous.seenBy.size;
  };

  const eventLoop = () =>
    fetch(`${server.url}/api/health/event-loop`).then((r) => r.json() as Promise<EventLoopDelay>);
  await eventLoop(); // starts the count afresh
  const cpuBefore = server.cpuTimesMs();
  const mainBefore = server.cpuTimesMs('main thread');
  const started = performance.now();
  const rssSamplesMb: number[] = [];
  const rssSampler = setInterval(() => rssSamplesMb.push(server.memoryMb().rss), 1000);
  const total = rate * seconds;
  const requests: Promise<void>[] = [];
  /** Like a kiosk's outbox, a technician's next punch goes out once the server answered the last. */
  const lastOf = new Map<number, Promise<void>>();
  let refused = 0;
  for (let i = 0; i < total; i++) {
    const wait = started + (i * 1000) / rate - performance.now();
    if (wait > 0) await new Promise((resolve) => setTimeout(resolve, wait));
    const tech = shift[i % shift.length]!;
    const cycle = CYCLES[tech.state];
    const kind = cycle[Math.floor(i / shift.length) % cycle.length]!;
    const send = async () => {
      settle(tech.technicianId);
      pending.set(tech.technicianId, {
        sentAt: performance.now(),
        shownAs: SHOWN_AS[kind]!,
        seenBy: new Set(),
      });
      const response = await fetch(`${server.url}/api/punches`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', authorization: `Bearer ${tech.token}` },
        body: JSON.stringify({
          id: randomUUID(),
          kind,
          ...(kind === 'job-on' || kind === 'job-off' ? { jobLineId: tech.jobLineId } : {}),
          ...(kind === 'break-start' ? { breakKind: 'rest' } : {}),
        }),
      });
      if (response.status === 201) return;
      refused++;
      if (refused <= 3) console.log(`  refused: ${response.status} ${await response.text()}`);
    };
    const request = (lastOf.get(tech.technicianId) ?? Promise.resolve()).then(send, send);
    lastOf.set(tech.technicianId, request);
    requests.push(request.catch(() => void refused++));
  }
  await Promise.all(requests);
  // The last deliveries: wait until every board has shown every punch, or a second passed.
  for (let waited = 0; waited < 1000; waited += 20) {
    if ([...pending.values()].every((punch) => punch.seenBy.size === boards.length)) break;
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
  const elapsedMs = performance.now() - started;
  clearInterval(rssSampler);
  const cpuAfter = server.cpuTimesMs();
  const mainAfter = server.cpuTimesMs('main thread');
  const serverSystemCpuMs = cpuAfter.system - cpuBefore.system;
  const serverCpuMs = cpuAfter.user - cpuBefore.user + serverSystemCpuMs;
  for (const technicianId of pending.keys()) settle(technicianId);
  for (const board of boards) board.off('floor.updated');
  return {
    sent: total,
    refused,
    latencies,
    missed,
    elapsedMs,
    serverCpuMs,
    serverSystemCpuMs,
    serverMainThreadCpuMs: mainAfter.user - mainBefore.user + mainAfter.system - mainBefore.system,
    eventLoop: await eventLoop(),
    rssSamplesMb,
  };
}
