/** Everything a request handler may use, built once per process and injected into createApp. */
import type { Db } from '../db/client';
import type { Env } from './env';
import type { Logger } from './lib/logger';
import type { Mailer } from './mail/mailer';
import type { JobSender } from './jobs/queue';
import type { FileStore } from './services/storage/file-store';

export type AppDeps = {
  env: Env;
  db: Db;
  logger: Logger;
  mailer: Mailer;
  /** Enqueues background jobs; set by startBackgroundServices (tests inject their own). */
  jobs?: JobSender;
  /** Where uploaded files live; defaults to the local folder DATA_DIR/files. */
  storage?: FileStore;
  /**
   * Set in a web process that runs the embedded worker: busy while its requests keep it busy
   * (server/lib/fieldwork-busy.ts); its estimation threads wait then.
   */
  fieldworkBusy?: Int32Array;
};
