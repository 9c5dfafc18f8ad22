import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const repoRoot = fileURLToPath(new URL('../../', import.meta.url));

export interface RunningServer {
  url: string;
  dataDir: string;
  /** Output so far, for a failing test to show. */
  log: () => string;
  kill: (signal?: NodeJS.Signals) => Promise<void>;
  restart: () => Promise<void>;
  stop: () => Promise<void>;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
    probe.on('error', reject);
  });
}

async function waitForHealth(url: string, child: ChildProcess, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}`);
    const ok = await fetch(`${url}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) return;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error('server did not become healthy');
}

/** The built product as `npm run serve` runs it, on a free port and a temporary data dir. */
export async function startServer(env: Record<string, string> = {}): Promise<RunningServer> {
  const dataDir = mkdtempSync(join(tmpdir(), 'baytime-e2e-'));
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  let output = '';
  let child: ChildProcess;
  const launch = async () => {
    child = spawn(process.execPath, ['server/dist/main.js'], {
      cwd: repoRoot,
      env: { ...process.env, PORT: String(port), BAYTIME_DATA_DIR: dataDir, BAYTIME_DEMO: '1', ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    await waitForHealth(url, child);
  };
  const kill = async (signal: NodeJS.Signals = 'SIGKILL') => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise((resolve) => child.once('exit', resolve));
    child.kill(signal);
    await exited;
  };
  await launch();
  return {
    url,
    dataDir,
    log: () => output,
    kill,
    restart: async () => {
      await kill('SIGKILL');
      await launch();
    },
    stop: async () => {
      await kill('SIGTERM');
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** The pairing code the demo server printed, or a new one from the foreman. */
export async function pairingCode(server: RunningServer): Promise<string> {
  return deviceCode(server, '/screens', 'e2e wall');
}

/** A one-time code for a kiosk tablet, from the foreman (Admin → Kiosks). */
export async function kioskPairingCode(server: RunningServer, name = 'e2e kiosk'): Promise<string> {
  return deviceCode(server, '/kiosks', name);
}

async function deviceCode(server: RunningServer, route: string, name: string): Promise<string> {
  const login = await fetch(`${server.url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'foreman@marlowcreek.test', password: 'baytime-demo' }),
  });
  const { accessToken } = (await login.json()) as { accessToken: string };
  const response = await fetch(`${server.url}/api${route}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', authorization: `Bearer ${accessToken}` },
    body: JSON.stringify({ name }),
  });
  return ((await response.json()) as { code: string }).code;
}
