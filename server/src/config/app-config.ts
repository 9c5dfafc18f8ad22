import { createSecretKey, randomBytes, type KeyObject } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { isAbsolute, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

export interface AppConfig {
  port: number;
  dataDir: string;
  dbFile: string;
  uploadsDir: string;
  backupsDir: string;
  adminEmail: string | null;
  adminPassword: string | null;
  demo: boolean;
  smtpUrl: string | null;
  /** Twilio's account and sending number (or messaging service id); null = the local text box. */
  twilio: { accountSid: string; authToken: string; from: string } | null;
  /** Where customers reach the server, for approval links; null = the address the office uses. */
  publicUrl: string | null;
  jwtSecret: string;
  /** A CA certificate file webhook deliveries trust besides the public CAs (the tests' own CA). */
  webhookCaFile: string | null;
  /**
   * The same secret as a key object, for signing and verifying: given a string, jsonwebtoken first
   * tries to read it as a PEM public key and catches the error, about 0.5 ms on every request.
   */
  jwtKey: KeyObject;
  /** `BAYTIME_BENCH_METRICS=1`: `GET /api/health/event-loop` answers event-loop delay for `npm run bench`. */
  benchMetrics: boolean;
  /** Built front ends to serve; absent in tests that only need the API. */
  staticRoot: string | null;
}

export const APP_CONFIG = Symbol('APP_CONFIG');

/** The checkout, where the front ends are built: the same from here as from the server's bundle. */
export const REPO_ROOT = fileURLToPath(new URL('../../../', import.meta.url));

const truthy = (value: string | undefined) => value !== undefined && /^(1|true|yes|on)$/i.test(value);

/** Reads the environment as the README documents it; creates the data dir and the JWT secret file. */
export function loadConfig(
  env: NodeJS.ProcessEnv = process.env,
  staticRoot: string | null = null,
): AppConfig {
  const dataDir = resolve(env.BAYTIME_DATA_DIR ?? './data');
  mkdirSync(dataDir, { recursive: true });
  const dbName = env.BAYTIME_DB ?? 'baytime.sqlite';
  const port = Number(env.PORT ?? 3000);
  if (!Number.isInteger(port) || port < 0 || port > 65535) throw new Error(`PORT is not a port: ${env.PORT}`);
  const adminEmail = env.BAYTIME_ADMIN_EMAIL?.trim() || null;
  const adminPassword = env.BAYTIME_ADMIN_PASSWORD || null;
  if ((adminEmail === null) !== (adminPassword === null))
    throw new Error('Set BAYTIME_ADMIN_EMAIL and BAYTIME_ADMIN_PASSWORD together');

  const twilio = {
    accountSid: env.BAYTIME_TWILIO_ACCOUNT_SID?.trim() ?? '',
    authToken: env.BAYTIME_TWILIO_AUTH_TOKEN?.trim() ?? '',
    from: env.BAYTIME_TWILIO_FROM?.trim() ?? '',
  };
  const twilioSet = Object.values(twilio).filter(Boolean).length;
  if (twilioSet !== 0 && twilioSet !== 3)
    throw new Error(
      'Set BAYTIME_TWILIO_ACCOUNT_SID, BAYTIME_TWILIO_AUTH_TOKEN and BAYTIME_TWILIO_FROM together',
    );
  const publicUrl = env.BAYTIME_PUBLIC_URL?.trim().replace(/\/+$/, '') || null;
  if (publicUrl && !/^https?:\/\/[^/\s]+(\/[^\s]*)?$/.test(publicUrl))
    throw new Error(`BAYTIME_PUBLIC_URL is not an http(s) address: ${publicUrl}`);

  const jwtSecret = env.JWT_SECRET || keptSecret(dataDir);
  const config: AppConfig = {
    port,
    dataDir,
    dbFile: isAbsolute(dbName) ? dbName : join(dataDir, dbName),
    uploadsDir: join(dataDir, 'uploads'),
    backupsDir: join(dataDir, 'backups'),
    adminEmail,
    adminPassword,
    demo: truthy(env.BAYTIME_DEMO),
    smtpUrl: env.BAYTIME_SMTP_URL?.trim() || null,
    twilio: twilioSet ? twilio : null,
    publicUrl,
    jwtSecret,
    webhookCaFile: env.BAYTIME_WEBHOOK_CA_FILE?.trim() || null,
    jwtKey: createSecretKey(Buffer.from(jwtSecret)),
    benchMetrics: truthy(env.BAYTIME_BENCH_METRICS),
    staticRoot,
  };
  mkdirSync(config.uploadsDir, { recursive: true });
  mkdirSync(config.backupsDir, { recursive: true });
  return config;
}

function keptSecret(dataDir: string): string {
  const file = join(dataDir, 'jwt-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}
