import { JwtService } from '@nestjs/jwt';
import { eq } from 'drizzle-orm';
import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { io, type Socket } from 'socket.io-client';
import {
  addIsoWeeks,
  buildLedger,
  workweekBounds,
  workweekOf,
  type BoardPerson,
  type ServerToClientEvents,
} from '@baytime/shared';
import { countRows, openDatabase } from '../db/database.js';
import { punches, screens } from '../db/schema/index.js';
import { DEFAULT_SHOP } from '../shop/shop.service.js';
import { toPunchDto } from '../labour/labour.service.js';
import { seedSyntheticYear } from './synthetic-year.js';

/** `npm run bench`: prints figures, the last line one JSON object. It reports; it never fails on speed. */
const KIOSKS = Number(process.env.BENCH_KIOSKS ?? 100);
const BOARDS = Number(process.env.BENCH_BOARDS ?? 20);
const PUNCHES_PER_SECOND = Number(process.env.BENCH_RATE ?? 20);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 15);
const REPORT_TECHS = 40;
const LEDGER_TECHS = 30;
const repoRoot = fileURLToPath(new URL('../../../', import.meta.url));
const figures: Record<string, number | string | null> = {};

const percentile = (sorted: number[], p: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? NaN;
const round = (n: number, digits = 1) => Math.round(n * 10 ** digits) / 10 ** digits;
function report(name: string, value: number | string | null, unit = ''): void {
  figures[name] = value;
  console.log(`${name.padEnd(34)} ${value}${unit ? ` ${unit}` : ''}`);
}
async function timed<T>(run: () => T | Promise<T>, times = 5): Promise<number> {
  const samples: number[] = [];
  for (let i = 0; i < times; i++) {
    const start = performance.now();
    await run();
    samples.push(performance.now() - start);
  }
  return samples.sort((a, b) => a - b)[Math.floor(samples.length / 2)]!;
}

const dataDir = mkdtempSync(join(tmpdir(), 'baytime-bench-'));
const secret = 'bench-only-secret';
const { connection, db } = openDatabase(join(dataDir, 'baytime.sqlite'));
console.log(`Seeding a year of punches for ${REPORT_TECHS} technicians…`);
const { technicianIds, idleTechnicianIds } = await seedSyntheticYear(db, {
  technicians: REPORT_TECHS,
  idleTechnicians: KIOSKS,
  days: 365,
});
report('punches in database', countRows(db, punches));

// 1. Ledger: a year of punches for 30 technicians, with the 52 weekly totals of each.
const yearPunches = technicianIds
  .slice(0, LEDGER_TECHS)
  .map((id) => db.select().from(punches).where(eq(punches.technicianId, id)).all().map(toPunchDto));
const now = new Date();
const ledgerMs = await timed(() => {
  for (const list of yearPunches) {
    const ledger = buildLedger(list, now, DEFAULT_SHOP);
    let week = workweekOf(now, DEFAULT_SHOP);
    for (let w = 0; w < 52; w++, week = addIsoWeeks(week, -1)) {
      const { from, to } = workweekBounds(week, DEFAULT_SHOP);
      ledger.within(from, to);
    }
  }
}, 3);
report(`ledger year x ${LEDGER_TECHS} techs (+52 weeks)`, round(ledgerMs), 'ms');

// Paired wall screens for the live test.
const screenIds = Array.from(
  { length: BOARDS },
  (_, i) =>
    db
      .insert(screens)
      .values({ name: `Bench wall ${i + 1}`, pairedAt: now, createdAt: now })
      .returning()
      .get().id,
);
connection.close();

// 2. The real server as a separate process, so its CPU and memory can be read from /proc.
const port = 3900 + Math.floor(Math.random() * 90);
const url = `http://127.0.0.1:${port}`;
const server = spawn(process.execPath, ['server/dist/main.js'], {
  cwd: repoRoot,
  env: {
    ...process.env,
    PORT: String(port),
    BAYTIME_DATA_DIR: dataDir,
    BAYTIME_DEMO: '0',
    JWT_SECRET: secret,
  },
  stdio: ['ignore', 'ignore', 'inherit'],
});
for (let i = 0; i < 200; i++) {
  if (
    await fetch(`${url}/api/health`).then(
      (r) => r.ok,
      () => false,
    )
  )
    break;
  await new Promise((r) => setTimeout(r, 100));
}
const jwt = new JwtService({ secret });

// 3. Reports over a year of punches (owner token minted with the server's secret).
const { users } = await import('../db/schema/index.js');
const reportDb = openDatabase(join(dataDir, 'baytime.sqlite'));
const ownerId = reportDb.db
  .insert(users)
  .values({ name: 'Bench Owner', role: 'owner', email: 'bench@example.test', createdAt: now })
  .returning()
  .get().id;
reportDb.connection.close();
const owner = jwt.sign({ sub: ownerId, role: 'owner' });
const lastWeek = addIsoWeeks(workweekOf(now, DEFAULT_SHOP), -1);
for (const kind of ['labour', 'pay'] as const) {
  const path = `${url}/api/reports/${kind}?week=${lastWeek}`;
  const probe = await fetch(path, { headers: { authorization: `Bearer ${owner}` } });
  report(
    `${kind} report, ${REPORT_TECHS} techs, 1 year`,
    probe.ok
      ? round(
          await timed(() =>
            fetch(path, { headers: { authorization: `Bearer ${owner}` } }).then((r) => r.text()),
          ),
        )
      : `n/a (${probe.status})`,
    probe.ok ? 'ms' : '',
  );
}

// 4. Live load: K kiosks and M wall boards on sockets, P punches a second over HTTP.
type Client = Socket<ServerToClientEvents>;
const connect = (token: string): Promise<Client> =>
  new Promise((resolve, reject) => {
    const socket: Client = io(url, { auth: { token }, transports: ['websocket'], reconnection: false });
    socket.once('board.snapshot', () => resolve(socket));
    socket.once('connect_error', reject);
  });
const kioskTokens = idleTechnicianIds.map((id) => ({ id, token: jwt.sign({ sub: id, role: 'technician' }) }));
const kiosks = await Promise.all(kioskTokens.map(({ token }) => connect(token)));
const boards = await Promise.all(screenIds.map((id) => connect(jwt.sign({ sub: id, role: 'display' }))));

const onShift = new Set<number>();
/** Per technician, the punch in flight: when it was sent, what the board should show, which boards saw it. */
const pending = new Map<number, { sentAt: number; expectOnShift: boolean; seenBy: Set<number> }>();
const latencies: number[] = [];
boards.forEach((board, boardNo) =>
  board.on('floor.updated', ({ people }: { people: BoardPerson[] }) => {
    const receivedAt = performance.now();
    const present = new Set(people.map((p) => p.id));
    for (const [techId, wait] of pending)
      if (!wait.seenBy.has(boardNo) && present.has(techId) === wait.expectOnShift) {
        wait.seenBy.add(boardNo);
        latencies.push(receivedAt - wait.sentAt);
      }
  }),
);
const cpuTicks = () => {
  const fields = readFileSync(`/proc/${server.pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
  return Number(fields[11]) + Number(fields[12]);
};
const peakRssKb = () =>
  Number(/VmHWM:\s+(\d+)/.exec(readFileSync(`/proc/${server.pid}/status`, 'utf8'))?.[1] ?? NaN);
const cpuBefore = cpuTicks();
const started = performance.now();
let sent = 0;
let refused = 0;
const total = PUNCHES_PER_SECOND * SECONDS;
await new Promise<void>((resolve) => {
  const timer = setInterval(async () => {
    if (sent >= total) {
      clearInterval(timer);
      resolve();
      return;
    }
    sent++;
    const { id, token } = kioskTokens[sent % kioskTokens.length]!;
    const kind = onShift.has(id) ? 'shift-out' : 'shift-in';
    if (kind === 'shift-in') onShift.add(id);
    else onShift.delete(id);
    pending.set(id, { sentAt: performance.now(), expectOnShift: kind === 'shift-in', seenBy: new Set() });
    const response = await fetch(`${url}/api/punches`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
      body: JSON.stringify({ id: randomUUID(), kind }),
    });
    if (response.status !== 201) refused++;
  }, 1000 / PUNCHES_PER_SECOND);
});
await new Promise((r) => setTimeout(r, 1500));
const elapsed = (performance.now() - started) / 1000;
const cpuSeconds = (cpuTicks() - cpuBefore) / 100;
const sorted = latencies.sort((a, b) => a - b);
report('kiosks / boards connected', `${kiosks.length} / ${boards.length}`);
report('punches sent / refused', `${sent} / ${refused}`);
report('sustained punches per second', round(sent / (elapsed - 1.5)));
report('punch-to-board p50', round(percentile(sorted, 50)), 'ms');
report('punch-to-board p95', round(percentile(sorted, 95)), 'ms');
report('punch-to-board p99', round(percentile(sorted, 99)), 'ms');
report('board deliveries measured', sorted.length);
report('server CPU during load', round((cpuSeconds / elapsed) * 100), '% of one core');
report('server peak memory (VmHWM)', round(peakRssKb() / 1024), 'MB');
for (const socket of [...kiosks, ...boards]) socket.disconnect();
server.kill('SIGTERM');

// 5. Initial JavaScript of each app, gzipped.
function initialJs(app: string, extra: RegExp | null = null): number {
  const dist = join(repoRoot, app, 'dist');
  const html = readFileSync(join(dist, 'index.html'), 'utf8');
  const files = new Set([...html.matchAll(/(?:src|href)="[^"]*?(assets\/[^"]+\.js)"/g)].map((m) => m[1]!));
  if (extra)
    for (const file of readdirSync(join(dist, 'assets')))
      if (extra.test(file) && file.endsWith('.js')) files.add(`assets/${file}`);
  return [...files].reduce((sum, file) => sum + gzipSync(readFileSync(join(dist, file))).length, 0) / 1000;
}
report('kiosk initial JS (gzip)', round(initialJs('kiosk')), 'kB');
report('board initial JS (gzip)', round(initialJs('board')), 'kB');
report('wall board route JS (gzip)', round(initialJs('board', /wall/i)), 'kB');

rmSync(dataDir, { recursive: true, force: true });
console.log(JSON.stringify(figures));
process.exit(0);
