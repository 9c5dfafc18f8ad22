import { JwtService } from '@nestjs/jwt';
import { randomUUID } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { setTimeout as delay } from 'node:timers/promises';
import { fileURLToPath } from 'node:url';
import { addIsoWeeks, workweekOf } from '@baytime/shared';
import { servesBundle } from '../build/fresh-bundle.js';
import { loadConfig } from '../config/app-config.js';
import { DEFAULT_SHOP } from '../shop/shop.service.js';
import { routeJsKb } from './bundle-size.js';
import { allSnapshots, connect, punchLoad } from './live-load.js';
import { ServerProcess } from './server-process.js';
import { seedBusyShop } from './synthetic-year.js';

/*
 * `npm run bench`: a 40-technician shop with three years of history, served by the built server in its
 * own process, measured from outside. Prints each figure, then one JSON line with the figures the
 * project tracks. It reports; it never fails on a target.
 *
 * BENCH_PROFILE=<dir> runs the measured server under `node --cpu-prof` and writes its profile there.
 * BENCH_PARTS=<list> runs only some parts, a comma list of `start`, `live`, `reads` and `bundles` (all by
 * default); the figures of the parts left out are null in the JSON line.
 */
const KIOSKS = 980;
const BOARDS = 20;
const RATE = 20;
const SECONDS = 30;
/** How long the server is watched holding its sockets with nothing happening. */
const REST_SECONDS = 10;
const profileDir = process.env.BENCH_PROFILE;
const PARTS = ['start', 'live', 'reads', 'bundles'] as const;
type Part = (typeof PARTS)[number];
const parts = new Set(
  (process.env.BENCH_PARTS ?? PARTS.join(','))
    .split(',')
    .map((part) => part.trim())
    .filter(Boolean),
);
for (const part of parts) {
  if (!(PARTS as readonly string[]).includes(part))
    throw new Error(`BENCH_PARTS: no part "${part}"; parts are ${PARTS.join(', ')}`);
}
const runs = (part: Part) => parts.has(part);
const needsServer = runs('start') || runs('live') || runs('reads');
const KEYS = [
  'history years',
  'punch-to-board p95 ms',
  'punch-to-board p99 ms',
  'server cpu ms per punch',
  'event loop delay p99 ms',
  'reconnect 1000 sockets ms',
  'server rss mb at 1000 sockets',
  'serve healthy ms',
  'repair order page ms',
  'labour report ms',
  'pay report ms',
  'kiosk initial js kb',
  'wall route js kb',
];
const repoRoot = fileURLToPath(new URL('../../../', import.meta.url));

const tracked: Record<string, number> = {};
const round = (value: number) => Math.round(value * 10) / 10;
function print(label: string, value: number | string, unit = ''): void {
  console.log(
    `${label.padEnd(44)} ${typeof value === 'number' ? round(value) : value}${unit ? ` ${unit}` : ''}`,
  );
}
function track(key: string, value: number, label: string, unit: string): void {
  tracked[key] = round(value);
  print(label, value, unit);
}
const percentile = (sorted: readonly number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? NaN;
const median = (values: readonly number[]) =>
  percentile(
    [...values].sort((a, b) => a - b),
    50,
  );

/**
 * Times `run` up to `times` times, stopping early once `budgetMs` is spent or `run` answers false (a
 * failed request is timed once); answers the samples.
 */
async function samples(run: () => Promise<boolean>, times: number, budgetMs: number): Promise<number[]> {
  const taken: number[] = [];
  const until = performance.now() + budgetMs;
  let again = true;
  while (again && taken.length < times && (taken.length === 0 || performance.now() < until)) {
    const start = performance.now();
    again = await run();
    taken.push(performance.now() - start);
  }
  return taken;
}

/** Asks `/api/health` one request after another until `running` settles: the slowest answer, ms. */
async function slowestHealthWhile(running: Promise<unknown>): Promise<number> {
  let settled = false;
  void running.finally(() => (settled = true));
  let slowest = 0;
  while (!settled) {
    const start = performance.now();
    await fetch(`${server.url}/api/health`);
    slowest = Math.max(slowest, performance.now() - start);
  }
  return slowest;
}

/** Other work on the machine slows every figure that is a time; the CPU times hold better. */
function machine(): string {
  const pressure = existsSync('/proc/pressure/cpu')
    ? /avg60=([\d.]+)/.exec(readFileSync('/proc/pressure/cpu', 'utf8'))?.[1]
    : undefined;
  const [load] = loadavg();
  return `${availableParallelism()} cores, Node ${process.versions.node}, load average ${load!.toFixed(1)}${pressure ? `, CPU pressure ${pressure}%` : ''}`;
}
print('machine', machine());
// A compile after the build (a typecheck, `tsc -b`) leaves the bundle behind, and the server then starts
// from its 1,600 compiled modules: about twice as slow to start and to take its sockets back.
print(
  'server code measured',
  servesBundle(new URL('../', import.meta.url))
    ? 'the bundle'
    : 'the compiled modules, not the bundle: run npm run build first',
);

if (runs('bundles')) {
  // 1. What a tablet and a wall screen download before they show anything, gzipped.
  track(
    'kiosk initial js kb',
    routeJsKb(join(repoRoot, 'kiosk/dist'), 'src/app/routes/sign-in.tsx'),
    'kiosk sign-in JS',
    'kB',
  );
  track(
    'wall route js kb',
    routeJsKb(join(repoRoot, 'board/dist'), 'src/app/routes/wall.tsx'),
    'wall route JS',
    'kB',
  );
}

if (!needsServer) finish();

// 2. The shop, written straight into a fresh database, and the JWT secret the server will read there.
const dataDir = mkdtempSync(join(tmpdir(), 'baytime-bench-'));
const config = loadConfig({ BAYTIME_DATA_DIR: dataDir });
const seedStart = performance.now();
const shop = await seedBusyShop(config.dbFile);
print('seeded in', (performance.now() - seedStart) / 1000, 's');
for (const [name, count] of Object.entries(shop.counts)) print(`  ${name}`, count.toLocaleString('en-US'));
track('history years', shop.historyYears, 'history', 'years');

const jwt = new JwtService({ secret: config.jwtKey, signOptions: { algorithm: 'HS256' } });
const kioskToken = (technicianId: number) =>
  jwt.sign({ sub: technicianId, role: 'technician' }, { expiresIn: '2h' });
const displayToken = (screenId: number) =>
  jwt.sign({ sub: screenId, role: 'display' }, { expiresIn: '3650d' });
const owner = {
  authorization: `Bearer ${jwt.sign({ sub: shop.ownerId, role: 'owner' }, { expiresIn: '1h' })}`,
};

// 3. Start-up on the three-year database: spawn → /api/health 200, three times; the last one stays up.
const port = 3900 + Math.floor(Math.random() * 90);
const server = new ServerProcess(
  repoRoot,
  config.dbFile,
  port,
  profileDir ? ['--cpu-prof', `--cpu-prof-dir=${profileDir}`] : [],
);
const starts: number[] = [];
for (let i = 0; i < (runs('start') ? 3 : 1); i++) {
  if (i > 0) await server.stop();
  starts.push(await server.start());
}
if (runs('start')) {
  print('serve healthy, each start', starts.map((ms) => Math.round(ms)).join(', '), 'ms');
  track('serve healthy ms', median(starts), 'serve healthy (median of 3)', 'ms');
}

if (runs('live')) {
  // 4. 980 kiosks and 20 wall boards on live sockets.
  const connectStart = performance.now();
  const connectCpu = server.cpuMs();
  const kiosks = Array.from({ length: KIOSKS }, (_, i) =>
    connect(server.url, kioskToken(shop.technicianIds[i % shop.technicianIds.length]!)),
  );
  const boards = shop.screenIds.slice(0, BOARDS).map((id) => connect(server.url, displayToken(id)));
  const sockets = [...kiosks, ...boards];
  const connected = await allSnapshots(sockets, 60_000);
  print(`${sockets.length} sockets hold a snapshot after`, connected - connectStart, 'ms');
  print(`  server CPU for ${sockets.length} connections`, server.cpuMs() - connectCpu, 'ms');
  // Holding the sockets costs CPU by itself (Socket.IO's heartbeats): what a punch adds is the rest.
  const restCpu = server.cpuMs();
  await delay(REST_SECONDS * 1000);
  const restCpuMsPerSecond = (server.cpuMs() - restCpu) / REST_SECONDS;
  print(`server CPU at rest with ${sockets.length} sockets`, restCpuMsPerSecond / 10, '% of one core');

  // 5. The load: 20 punches a second for 30 s, from kiosks of the technicians on shift.
  const load = await punchLoad(
    server,
    boards,
    shop.onShift.map((tech) => ({ ...tech, token: kioskToken(tech.technicianId) })),
    { rate: RATE, seconds: SECONDS },
  );
  const latencies = load.latencies.sort((a, b) => a - b);
  print('punches sent / refused', `${load.sent} / ${load.refused}`);
  print('board deliveries measured / missed', `${latencies.length} / ${load.missed}`);
  print('punch-to-board p50', percentile(latencies, 50), 'ms');
  track('punch-to-board p95 ms', percentile(latencies, 95), 'punch-to-board p95', 'ms');
  track('punch-to-board p99 ms', percentile(latencies, 99), 'punch-to-board p99', 'ms');
  print('server CPU during the load', (load.serverCpuMs / load.elapsedMs) * 100, '% of one core');
  track('server cpu ms per punch', load.serverCpuMs / load.sent, 'server CPU per punch', 'ms');
  print('  of which in the kernel (sockets, disk)', load.serverSystemCpuMs / load.sent, 'ms');
  print('  of which on the main thread (event loop)', load.serverMainThreadCpuMs / load.sent, 'ms');
  print(
    '  beyond the cost of holding the sockets',
    (load.serverCpuMs - (restCpuMsPerSecond * load.elapsedMs) / 1000) / load.sent,
    'ms',
  );
  print(
    'event loop delay p50 / max',
    `${round(load.eventLoop.p50Ms)} / ${round(load.eventLoop.maxMs)}`,
    'ms',
  );
  track('event loop delay p99 ms', load.eventLoop.p99Ms, 'event loop delay p99', 'ms');
  const memory = server.memoryMb();
  track('server rss mb at 1000 sockets', memory.rss, `server RSS with ${sockets.length} sockets`, 'MB');
  print('server peak RSS so far', memory.peak, 'MB');
  const rss = load.rssSamplesMb;
  print(
    '  RSS in the load (each s), min / med / max',
    `${round(Math.min(...rss))} / ${round(median(rss))} / ${round(Math.max(...rss))}`,
    'MB',
  );

  // 6. Kill the server and start it again: every socket reconnects by itself and gets a fresh snapshot.
  await server.stop(profileDir ? 'SIGINT' : 'SIGKILL');
  const snapshots = allSnapshots(sockets, 120_000);
  const restart = performance.now();
  const restartHealthyMs = await server.start();
  const reconnectCpu = server.cpuMs();
  const allBack = await snapshots;
  const reconnectCpuMs = server.cpuMs() - reconnectCpu;
  print('restarted server healthy after', restartHealthyMs, 'ms');
  print(`${sockets.length} sockets back, after healthy`, allBack - restart - restartHealthyMs, 'ms');
  print(`  server CPU from healthy to all back`, reconnectCpuMs, 'ms');
  track(
    'reconnect 1000 sockets ms',
    allBack - restart,
    `${sockets.length} sockets back, after restart`,
    'ms',
  );
  for (const socket of sockets) socket.close();
  // The reads below are timed on a server that has let the thousand sockets go.
  await server.quiet();
}

if (runs('reads')) {
  // 7. Reads over the three years: a week's reports, a page of repair orders with a search.
  const lastWeek = addIsoWeeks(workweekOf(new Date(), DEFAULT_SHOP), -1);
  const report = (kind: 'labour' | 'pay') => async () => {
    const response = await fetch(`${server.url}/api/reports/${kind}?week=${lastWeek}`, { headers: owner });
    if (!response.ok) throw new Error(`${kind} report: ${response.status} ${await response.text()}`);
    return (await response.text()).length > 0;
  };
  for (const [kind, key] of [
    ['labour', 'labour report ms'],
    ['pay', 'pay report ms'],
  ] as const) {
    const first = samples(report(kind), 1, 0);
    const healthMeanwhile = await slowestHealthWhile(first);
    print(`${kind} report ${lastWeek}, first`, (await first)[0]!, 'ms');
    print('  /api/health meanwhile, slowest answer', healthMeanwhile, 'ms');
    const rest = await samples(report(kind), 5, 20_000);
    track(key, median(rest), `${kind} report ${lastWeek}, median of ${rest.length}`, 'ms');
  }
  // In a working shop a punch comes between two reports: a technician off today clocks in and out.
  const offToday = kioskToken(shop.technicianIds.at(-1)!);
  const afterPunch: number[] = [];
  for (const kind of ['shift-in', 'shift-out', 'shift-in']) {
    await fetch(`${server.url}/api/punches`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${offToday}` },
      body: JSON.stringify({ id: randomUUID(), kind }),
    });
    const start = performance.now();
    await report('labour')();
    afterPunch.push(performance.now() - start);
  }
  print('labour report just after a punch, median of 3', median(afterPunch), 'ms');
  // A timecard of the running week is counted afresh at every instant it is asked at.
  const card = `${server.url}/api/timecards?technicianId=${shop.technicianIds[0]!}`;
  const cardTimes = await samples(
    async () => {
      const response = await fetch(card, { headers: owner });
      return (await response.text()).length > 0 && response.ok;
    },
    10,
    20_000,
  );
  print(`running week's timecard, median of ${cardTimes.length}`, median(cardTimes), 'ms');

  const page = `${server.url}/api/repair-orders?limit=50&q=${encodeURIComponent(shop.searchTerm)}`;
  const answers: { status: number; bytes: number }[] = [];
  const pageTimes = await samples(
    async () => {
      const response = await fetch(page, { headers: owner });
      answers.push({ status: response.status, bytes: (await response.arrayBuffer()).byteLength });
      return response.ok;
    },
    20,
    30_000,
  );
  const answered = answers.at(-1)!;
  print('repair order page answer', `${answered.status}, ${round(answered.bytes / 1000)} kB`);
  track('repair order page ms', median(pageTimes), `repair order page, median of ${pageTimes.length}`, 'ms');
}
await server.stop(profileDir ? 'SIGINT' : 'SIGTERM');
rmSync(dataDir, { recursive: true, force: true });
finish();

/** Prints the machine's load again and the JSON line of every tracked figure, null for a part not run. */
function finish(): never {
  print('machine', machine());
  console.log(JSON.stringify(Object.fromEntries(KEYS.map((key) => [key, tracked[key] ?? null]))));
  process.exit(0);
}
