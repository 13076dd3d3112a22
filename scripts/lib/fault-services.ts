/**
 * The services a fault benchmark may break on purpose, private to it so that nobody else's
 * database or mail goes down with them: a PostgreSQL cluster of its own (scripts/pg.sh with
 * its own data folder and port) and a fake mail server of its own (scripts/mail.sh on its own
 * ports), each of which it can stop, start and restart.
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import pg from 'pg';

const root = path.resolve(import.meta.dirname, '../..');

function script(name: 'pg.sh' | 'mail.sh', args: string[], dataDir: string, extra = {}) {
  const env: NodeJS.ProcessEnv = { ...process.env, CW_DATA_DIR: dataDir, ...extra };
  // pg.sh leaves the cluster alone whenever DATABASE_URL names another server.
  delete env.DATABASE_URL;
  return execFileSync(path.join(root, 'scripts', name), args, {
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
  })
    .toString()
    .trim();
}

export type PrivateCluster = {
  url: string;
  adminUrl: string;
  /** Stops (fast shutdown: sessions are cut) and starts the server again. */
  restart(): void;
  /** Ends every other session on the benchmark's database (pg_terminate_backend). */
  terminateBackends(): Promise<number>;
  stop(): void;
};

export function startPrivateCluster(dataDir: string, port: number, db: string): PrivateCluster {
  const env = { CW_PG_PORT: String(port), CW_DB_NAME: db };
  script('pg.sh', ['start'], dataDir, env);
  const url = script('pg.sh', ['url', db], dataDir, env);
  const adminUrl = script('pg.sh', ['url', 'postgres'], dataDir, env);
  return {
    url,
    adminUrl,
    restart() {
      script('pg.sh', ['stop'], dataDir, env);
      script('pg.sh', ['start'], dataDir, env);
    },
    async terminateBackends() {
      const c = new pg.Client({ connectionString: adminUrl });
      await c.connect();
      try {
        const r = await c.query(
          `select pg_terminate_backend(pid) from pg_stat_activity
            where datname = $1 and pid <> pg_backend_pid()`,
          [db],
        );
        return r.rowCount ?? 0;
      } finally {
        await c.end();
      }
    },
    stop() {
      script('pg.sh', ['stop'], dataDir, env);
    },
  };
}

export type PrivateMail = {
  smtpPort: number;
  start(): void;
  stop(): void;
  /** Every message received since the server last started, by recipient address. */
  countByRecipient(): Promise<Map<string, number>>;
};

/**
 * maildev keeps messages in memory only: the benchmark stops it before anything is sent and
 * reads the inbox after the last start, so every message is counted once.
 */
export function privateMail(dataDir: string, smtpPort: number, webPort: number): PrivateMail {
  const ports = [String(smtpPort), String(webPort)];
  return {
    smtpPort,
    start: () => void script('mail.sh', ['start', ...ports], dataDir),
    stop: () => void script('mail.sh', ['stop', ...ports], dataDir),
    async countByRecipient() {
      const res = await fetch(`http://127.0.0.1:${webPort}/api/email`);
      const all = (await res.json()) as Array<{ to: Array<{ address: string }> }>;
      const counts = new Map<string, number>();
      for (const m of all)
        for (const t of m.to) {
          const a = t.address.toLowerCase();
          counts.set(a, (counts.get(a) ?? 0) + 1);
        }
      return counts;
    },
  };
}
