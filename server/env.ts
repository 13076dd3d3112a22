/**
 * Configuration, read and validated once. Nothing else in the server reads process.env.
 * Defaults suit the local set-up started by scripts/start.sh; production overrides them.
 */
import { z } from 'zod';
import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';

const root = path.resolve(import.meta.dirname, '..');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(5180),
  /** Public base URL used in e-mailed links. */
  APP_URL: z.string().url().optional(),
  DATABASE_URL: z.string().default('postgres://postgres@127.0.0.1:54329/choicewright'),
  DATA_DIR: z.string().default(path.join(root, '.data')),
  JWT_SECRET: z.string().min(32).optional(),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().default(1025),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  SMTP_SECURE: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  MAIL_FROM: z.string().default('Choicewright <no-reply@choicewright.local>'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Run design/estimation jobs inside the web process too (single-machine set-up). */
  EMBEDDED_WORKER: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  WORKER_THREADS: z.coerce.number().int().min(1).max(64).default(2),
  /** Requests per 15 minutes per IP on sign-in, sign-up and reset routes. */
  AUTH_RATE_LIMIT: z.coerce.number().int().min(1).default(50),
  /** New respondent sessions per 15 minutes per IP (a panel behind one address needs headroom). */
  RESPONDENT_START_RATE_LIMIT: z.coerce.number().int().min(1).default(300),

  // Database faults (db/client.ts): fail fast while PostgreSQL is unreachable, never hang.
  DB_POOL_SIZE: z.coerce.number().int().min(1).max(500).default(20),
  DB_CONNECT_TIMEOUT_MS: z.coerce.number().int().min(100).default(5_000),
  DB_STATEMENT_TIMEOUT_MS: z.coerce.number().int().min(100).default(30_000),
  DB_IDLE_IN_TRANSACTION_TIMEOUT_MS: z.coerce.number().int().min(100).default(15_000),
  /** Nice value of design and estimation threads (0 = same priority as requests; 19 lowest). */
  ENGINE_THREAD_NICE: z.coerce.number().int().min(0).max(19).default(10),
});

export type Env = z.infer<typeof envSchema> & { JWT_SECRET: string; APP_URL: string };

/** Keeps a random signing secret in the git-ignored data folder when none is configured. */
function loadOrCreateSecret(dataDir: string): string {
  const file = path.join(dataDir, 'jwt-secret');
  try {
    const s = fs.readFileSync(file, 'utf8').trim();
    if (s.length >= 32) return s;
  } catch {
    // first start: create it below
  }
  fs.mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Invalid configuration:\n${lines}`);
  }
  const e = parsed.data;
  return {
    ...e,
    JWT_SECRET: e.JWT_SECRET ?? loadOrCreateSecret(e.DATA_DIR),
    APP_URL: e.APP_URL ?? `http://${e.HOST}:${e.PORT}`,
  };
}

export const projectRoot = root;
