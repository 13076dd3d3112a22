/**
 * User accounts. Tenant: none applies: a user belongs to no one team; found by id (the signed-in
 * user, a member) or by e-mail (sign-in, sign-up, invitations).
 */
import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { users } from '../schema/accounts';

const userColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  passwordHash: users.passwordHash,
  emailVerifiedAt: users.emailVerifiedAt,
  createdAt: users.createdAt,
};

export async function getUserById(db: DbOrTx, params: { id: string }) {
  const [row] = await db.select(userColumns).from(users).where(eq(users.id, params.id));
  return row ?? null;
}

export async function getUserByEmail(db: DbOrTx, params: { email: string }) {
  const [row] = await db
    .select(userColumns)
    .from(users)
    .where(eq(users.email, params.email.toLowerCase()));
  return row ?? null;
}

export async function insertUser(
  db: DbOrTx,
  params: { email: string; name: string; passwordHash: string; emailVerifiedAt?: Date | null },
) {
  const [row] = await db
    .insert(users)
    .values({
      email: params.email.toLowerCase(),
      name: params.name,
      passwordHash: params.passwordHash,
      emailVerifiedAt: params.emailVerifiedAt ?? null,
    })
    .returning(userColumns);
  return row;
}

export async function updateUser(
  db: DbOrTx,
  params: { id: string; name?: string; passwordHash?: string },
) {
  const [row] = await db
    .update(users)
    .set({
      ...(params.name !== undefined ? { name: params.name } : {}),
      ...(params.passwordHash !== undefined ? { passwordHash: params.passwordHash } : {}),
      updatedAt: new Date(),
    })
    .where(eq(users.id, params.id))
    .returning(userColumns);
  return row ?? null;
}
