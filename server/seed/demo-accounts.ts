/**
 * Demo team "Larkspur Valley Water" (an invented utility) with one user per role. Passwords are
 * random per installation, kept in the git-ignored data folder and printed by the start command.
 */
import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { hashPassword } from '../lib/passwords';
import { eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { memberships, teams, users } from '../../db/schema/accounts';
import type { Role } from '../../shared/permissions';

export const DEMO_TEAM_NAME = 'Larkspur Valley Water';

export type DemoCredential = { role: Role; name: string; email: string; password: string };

const people: Array<Omit<DemoCredential, 'password'>> = [
  { role: 'owner', name: 'Maren Okafor', email: 'owner@larkspur-water.example' },
  { role: 'editor', name: 'Tomas Lindqvist', email: 'editor@larkspur-water.example' },
  { role: 'analyst', name: 'Priya Raman', email: 'analyst@larkspur-water.example' },
  { role: 'viewer', name: 'Jonah Fairweather', email: 'viewer@larkspur-water.example' },
];

function loadCredentials(file: string): DemoCredential[] {
  try {
    const saved = JSON.parse(fs.readFileSync(file, 'utf8')) as DemoCredential[];
    if (people.every((p) => saved.some((s) => s.email === p.email && s.password))) return saved;
  } catch {
    // none yet
  }
  const fresh = people.map((p) => ({
    ...p,
    password: `demo-${randomBytes(6).toString('base64url')}`,
  }));
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, JSON.stringify(fresh, null, 2), { mode: 0o600 });
  return fresh;
}

/** Idempotent: creates what is missing and resets the demo passwords to the saved ones. */
export async function seedDemoAccounts(
  db: Db,
  credentialsFile: string,
): Promise<{ teamId: string; ownerId: string; credentials: DemoCredential[] }> {
  const credentials = loadCredentials(credentialsFile);
  return db.transaction(async (tx) => {
    let [team] = await tx
      .select({ id: teams.id })
      .from(teams)
      .where(eq(teams.name, DEMO_TEAM_NAME))
      .limit(1);
    if (!team)
      [team] = await tx.insert(teams).values({ name: DEMO_TEAM_NAME }).returning({ id: teams.id });
    let ownerId = '';
    for (const c of credentials) {
      const passwordHash = await hashPassword(c.password);
      const [u] = await tx
        .insert(users)
        // Demo accounts are confirmed, so the printed sign-ins work at once.
        .values({ email: c.email, name: c.name, passwordHash, emailVerifiedAt: new Date() })
        .onConflictDoUpdate({
          target: users.email,
          set: {
            passwordHash,
            name: c.name,
            emailVerifiedAt: sql`coalesce(${users.emailVerifiedAt}, now())`,
          },
        })
        .returning({ id: users.id });
      await tx
        .insert(memberships)
        .values({ teamId: team.id, userId: u.id, role: c.role })
        .onConflictDoUpdate({
          target: [memberships.teamId, memberships.userId],
          set: { role: c.role },
        });
      if (c.role === 'owner') ownerId = u.id;
    }
    return { teamId: team.id, ownerId, credentials };
  });
}
