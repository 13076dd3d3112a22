/** Everything a request handler may use, built once per process and injected into createApp. */
import type { Db } from '../db/client';
import type { Env } from './env';
import type { Logger } from './lib/logger';
import type { Mailer } from './mail/mailer';

export type AppDeps = {
  env: Env;
  db: Db;
  logger: Logger;
  mailer: Mailer;
};
