/** The demo accounts the e2e server's seed wrote (scripts/e2e-server.sh), one per role. */
import fs from 'node:fs';
import path from 'node:path';

export type DemoCredential = { role: string; email: string; password: string };

export function demoCredential(role: 'owner' | 'editor' | 'analyst' | 'viewer'): DemoCredential {
  const file =
    process.env.E2E_DEMO_CREDENTIALS ??
    path.resolve(import.meta.dirname, '../../.data/e2e-demo-credentials.json');
  const all = JSON.parse(fs.readFileSync(file, 'utf8')) as DemoCredential[];
  const found = all.find((c) => c.role === role);
  if (!found) throw new Error(`no demo ${role} in ${file}`);
  return found;
}
