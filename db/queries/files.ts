/**
 * Metadata of uploaded files; the bytes are in the storage module. Tenant: rows carry the team;
 * the look-up by storage key serves level images to respondents, who have no sign-in: the
 * random key is what grants access (services/storage/level-images.ts).
 */
import { eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { storedFiles } from '../schema/studies';

export async function insertStoredFile(
  db: DbOrTx,
  params: {
    teamId: string;
    studyId: string | null;
    storageKey: string;
    contentType: string;
    sizeBytes: number;
    originalName: string;
  },
) {
  const [row] = await db.insert(storedFiles).values(params).returning({
    id: storedFiles.id,
    storageKey: storedFiles.storageKey,
    contentType: storedFiles.contentType,
    sizeBytes: storedFiles.sizeBytes,
  });
  return row;
}

/** Public look-up by the unguessable key (level images are shown to respondents). */
export async function getStoredFileByKey(db: DbOrTx, params: { storageKey: string }) {
  const [row] = await db
    .select({ storageKey: storedFiles.storageKey, contentType: storedFiles.contentType })
    .from(storedFiles)
    .where(eq(storedFiles.storageKey, params.storageKey));
  return row ?? null;
}
