/**
 * Configuration, read and validated once. Nothing else in the server reads process.env.
 * Defaults suit the local set-up started by scripts/start.sh; production overrides them.
 */
import { z } from 'zod';
import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';

const root = path.resolve(import.meta.dirname, '..');

/**
 * Cost of new password hashes (server/lib/passwords.ts): `standard` everywhere people sign in;
 * `test` (the least Argon2id cost, ~0.3 ms instead of ~40 ms) only so that the test suites'
 * hundreds of throwaway accounts do not spend a CPU minute hashing. Refused unless NODE_ENV=test.
 */
const passwordHashStrengthSchema = z.enum(['standard', 'test']).default('standard');
export type PasswordHashStrength = z.infer<typeof passwordHashStrengthSchema>;

const passwordHashSettings = z
  .object({
    NODE_ENV: z.string().optional(),
    PASSWORD_HASH_STRENGTH: passwordHashStrengthSchema,
  })
  .refine((e) => e.PASSWORD_HASH_STRENGTH !== 'test' || e.NODE_ENV === 'test', {
    path: ['PASSWORD_HASH_STRENGTH'],
    message: '"test" is accepted only when NODE_ENV=test',
  });

/** The password hash cost, validated on its own because the hashing module needs no other setting. */
export function readPasswordHashStrength(
  source: NodeJS.ProcessEnv = process.env,
): PasswordHashStrength {
  const parsed = passwordHashSettings.safeParse(source);
  if (!parsed.success) throw new Error(`Invalid configuration:\n${issueLines(parsed.error)}`);
  return parsed.data.PASSWORD_HASH_STRENGTH;
}

const issueLines = (error: z.ZodError) =>
  error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');

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
  /**
   * Web processes sharing PORT on this machine (server/web-cluster.ts); only the first runs
   * the embedded job worker.
   */
  WEB_INSTANCES: z.coerce.number().int().min(1).max(64).default(1),
  /**
   * Least time between two saved checkpoints of a mixed logit run, in ms: what a worker restart
   * can lose at most (0 = after every iteration; each save writes the optimiser's state).
   */
  RUN_CHECKPOINT_EVERY_MS: z.coerce.number().int().min(0).max(600_000).default(5_000),
  /** Mixed-logit kernel: auto (WebAssembly SIMD when it can run), simd, or typescript. */
  ESTIMATION_KERNEL: z.enum(['auto', 'simd', 'typescript']).default('auto'),
  /** Engine memory one estimation run may need; larger specifications are refused before queuing. */
  ESTIMATION_MEMORY_LIMIT_MB: z.coerce.number().int().min(64).default(2048),
  /**
   * Which proxies' X-Forwarded-For / -Proto to believe, as Express's "trust proxy" setting:
   * `loopback` (default), `false`, a hop count such as `1`, or addresses/subnets separated by
   * commas (`10.0.0.0/8, fc00::/7`). Set it to the load balancer's address so that per-address
   * rate limits count clients, not the balancer.
   */
  TRUST_PROXY: z
    .string()
    .default('loopback')
    .transform((v): boolean | number | string =>
      v === 'true' ? true : v === 'false' ? false : /^\d+$/.test(v) ? Number(v) : v,
    ),
  /** Origins besides APP_URL allowed to send state-changing requests (comma-separated). */
  TRUSTED_ORIGINS: z
    .string()
    .default('')
    .transform((v) =>
      v
        .split(',')
        .map((o) => o.trim())
        .filter(Boolean),
    ),
  /** A researcher's session ends after this many minutes without a request… */
  SESSION_IDLE_MINUTES: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 60)
    .default(30),
  /** …and this many hours after signing in, whatever happens. */
  SESSION_ABSOLUTE_HOURS: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 30)
    .default(12),
  /** Requests per 15 minutes per IP on sign-in, sign-up and reset routes. */
  AUTH_RATE_LIMIT: z.coerce.number().int().min(1).default(50),
  /** Failed sign-ins per 15 minutes per account, from any address. */
  ACCOUNT_SIGN_IN_LIMIT: z.coerce.number().int().min(1).default(10),
  /** Requests per 15 minutes per respondent session (a survey needs a few dozen). */
  RESPONDENT_SESSION_RATE_LIMIT: z.coerce.number().int().min(1).default(600),
  /** New respondent sessions per 15 minutes per IP (a panel behind one address needs headroom). */
  RESPONDENT_START_RATE_LIMIT: z.coerce.number().int().min(1).default(300),

  // Database faults (db/client.ts): fail fast while PostgreSQL is unreachable, never hang.
  DB_POOL_SIZE: z.coerce.number().int().min(1).max(500).default(20),
  DB_CONNECT_TIMEOUT_MS: z.coerce.number().int().min(100).default(5_000),
  DB_STATEMENT_TIMEOUT_MS: z.coerce.number().int().min(100).default(30_000),
  DB_IDLE_IN_TRANSACTION_TIMEOUT_MS: z.coerce.number().int().min(100).default(15_000),
  /** Largest choice or background file an import accepts, in MB (larger: 413). */
  IMPORT_MAX_MB: z.coerce.number().positive().default(256),
  /** Nice value of design and estimation threads (0 = same priority as requests; 19 lowest). */
  ENGINE_THREAD_NICE: z.coerce.number().int().min(0).max(19).default(10),
  /**
   * Respondents first: a web process running the embedded worker holds its estimation and
   * design jobs (mixed logit between likelihood evaluations, HB every 50 iterations, latent class
   * between EM iterations, design searches between passes) while its event loop is at least
   * this busy (0–1; 0 never holds).
   * See server/lib/fieldwork-busy.ts and docs/methods.md ("Fieldwork before estimation").
   */
  ENGINE_YIELD_UTILISATION: z.coerce.number().min(0).max(1).default(0.2),
  PASSWORD_HASH_STRENGTH: passwordHashStrengthSchema,
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
  if (!parsed.success) throw new Error(`Invalid configuration:\n${issueLines(parsed.error)}`);
  const e = parsed.data;
  readPasswordHashStrength(source);
  // Several API instances must share one key, and a key made up on the spot would sign everyone
  // out at each restart: production names it (the local start command keeps one in DATA_DIR).
  if (e.NODE_ENV === 'production' && !e.JWT_SECRET)
    throw new Error(
      'Invalid configuration:\n  JWT_SECRET: required in production (at least 32 characters, the same on every API instance)',
    );
  return {
    ...e,
    JWT_SECRET: e.JWT_SECRET ?? loadOrCreateSecret(e.DATA_DIR),
    APP_URL: e.APP_URL ?? `http://${e.HOST}:${e.PORT}`,
  };
}

export const projectRoot = root;
