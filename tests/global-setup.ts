/**
 * Vitest global setup: makes sure a PostgreSQL server is reachable and prepares a migrated
 * template database for this run. Each API test file then clones the template into its own
 * database (tests/support/test-db.ts), so tests never touch demo data nor each other.
 */
import { execFileSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { createTemplateDatabase, dropDatabase, dropFileDatabases } from './support/template-db';

export default async function setup() {
  const root = path.resolve(import.meta.dirname, '..');
  let adminUrl = process.env.DATABASE_URL;
  if (!adminUrl) {
    execFileSync(path.join(root, 'scripts/pg.sh'), ['start'], { stdio: 'inherit' });
    adminUrl = execFileSync(path.join(root, 'scripts/pg.sh'), ['url', 'postgres'])
      .toString()
      .trim();
  }
  // Fake SMTP server for the tests (ports apart from the start command's).
  const smtpPort = process.env.CW_TEST_SMTP_PORT ?? '1125';
  const webPort = process.env.CW_TEST_MAIL_WEB_PORT ?? '1180';
  execFileSync(path.join(root, 'scripts/mail.sh'), ['start', smtpPort, webPort], {
    stdio: 'inherit',
  });
  process.env.CW_TEST_SMTP_PORT = smtpPort;
  process.env.CW_TEST_MAIL_WEB_PORT = webPort;
  const template = `cw_tpl_${process.pid}_${randomBytes(3).toString('hex')}`;
  await createTemplateDatabase(adminUrl, template);
  process.env.CW_TEST_ADMIN_URL = adminUrl;
  process.env.CW_TEST_TEMPLATE_DB = template;
  return async () => {
    // The files drop their databases without waiting; those still there go now.
    await dropFileDatabases(adminUrl!, template);
    await dropDatabase(adminUrl!, template);
  };
}
