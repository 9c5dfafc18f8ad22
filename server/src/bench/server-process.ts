import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { setTimeout as delay } from 'node:timers/promises';
import { dirname, join } from 'node:path';

/** Linux reports process times in clock ticks of 1/100 s (`getconf CLK_TCK`). */
const TICKS_PER_SECOND = 100;
const QUIET_WINDOW_MS = 200;

/**
 * `node server/dist/main.js` as its own process on the bench's database, so its CPU time and memory
 * are read from /proc as for any process, and nothing of the bench runs inside it.
 */
export class ServerProcess {
  private child: ChildProcess | null = null;
  readonly url: string;

  constructor(
    private readonly repoRoot: string,
    private readonly dbFile: string,
    readonly port: number,
    /** Extra node flags, e.g. `--cpu-prof`. */
    private readonly nodeFlags: string[] = [],
  ) {
    this.url = `http://127.0.0.1:${port}`;
  }

  get pid(): number {
    if (!this.child?.pid) throw new Error('The server is not running');
    return this.child.pid;
  }

  /** Starts the server; answers the milliseconds from spawn until `/api/health` answered 200. */
  async start(): Promise<number> {
    const started = performance.now();
    const { JWT_SECRET: _secretFromShell, ...env } = process.env;
    const child = spawn(process.execPath, [...this.nodeFlags, join(this.repoRoot, 'server/dist/main.js')], {
      cwd: this.repoRoot,
      env: {
        ...env,
        PORT: String(this.port),
        BAYTIME_DATA_DIR: dirname(this.dbFile),
        BAYTIME_DB: this.dbFile,
        // As `npm run serve`: the demo checks run, and find a shop that is not empty.
        BAYTIME_DEMO: '1',
        BAYTIME_BENCH_METRICS: '1',
      },
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    this.child = child;
    // If the bench stops half-way, the server goes with it.
    const orphan = () => child.kill('SIGKILL');
    process.once('exit', orphan);
    child.once('exit', () => process.off('exit', orphan));
    const exited = new Promise<never>((_, reject) =>
      child.once('exit', (code, signal) => reject(new Error(`The server stopped (${code ?? signal})`))),
    );
    exited.catch(() => undefined);
    while (!(await Promise.race([this.healthy(), exited]))) await new Promise((r) => setTimeout(r, 10));
    return performance.now() - started;
  }

  /** Stops the server with `signal` and waits for the process to end. */
  async stop(signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
    const child = this.child;
    this.child = null;
    if (!child || child.exitCode !== null || child.signalCode !== null) return;
    const ended = new Promise((resolve) => child.once('exit', resolve));
    child.kill(signal);
    await ended;
  }

  /** User and system CPU time the process has used so far, in ms. */
  cpuMs(): number {
    const { user, system } = this.cpuTimesMs();
    return user + system;
  }

  /**
   * CPU time so far in ms: in the process's own code, and in the kernel on its behalf (sockets, disk).
   * Of all its threads, or of the main thread alone: the event loop, without V8's collector threads.
   */
  cpuTimesMs(of: 'process' | 'main thread' = 'process'): { user: number; system: number } {
    const stat = of === 'process' ? `/proc/${this.pid}/stat` : `/proc/${this.pid}/task/${this.pid}/stat`;
    // Fields after the command name, which is in parentheses: utime and stime are the 12th and 13th.
    const fields = readFileSync(stat, 'utf8').split(') ')[1]!.split(' ');
    const ms = (ticks: string | undefined) => (Number(ticks) * 1000) / TICKS_PER_SECOND;
    return { user: ms(fields[11]), system: ms(fields[12]) };
  }

  /**
   * Waits until the process uses under a tenth of a core over a fifth of a second (ticks of 10 ms make
   * that the finest reading), so what follows is not measured against work left from before.
   */
  async quiet(timeoutMs = 10_000): Promise<void> {
    const until = performance.now() + timeoutMs;
    while (performance.now() < until) {
      const before = this.cpuMs();
      await delay(QUIET_WINDOW_MS);
      if (this.cpuMs() - before < QUIET_WINDOW_MS / 10) return;
    }
    throw new Error(`the server stayed busy for ${timeoutMs} ms`);
  }

  /** Resident memory now (`VmRSS`) and at its peak (`VmHWM`), in MB. */
  memoryMb(): { rss: number; peak: number } {
    const status = readFileSync(`/proc/${this.pid}/status`, 'utf8');
    const kb = (field: string) => Number(new RegExp(`${field}:\\s+(\\d+)`).exec(status)?.[1] ?? NaN);
    return { rss: kb('VmRSS') / 1024, peak: kb('VmHWM') / 1024 };
  }

  private healthy(): Promise<boolean> {
    return fetch(`${this.url}/api/health`).then(
      (response) => response.ok,
      () => false,
    );
  }
}
