/**
 * Level images: an editor uploads a PNG, JPEG or WebP of at most 2 MB for a study; its metadata
 * (EXIF, XMP) is removed; anyone with the unguessable key can read it (respondents see it).
 */
import path from 'node:path';
import { nanoid } from 'nanoid';
import type { AppDeps } from '../../deps';
import { NotFoundError, ValidationError } from '../../lib/errors';
import { loadDraftStudy } from '../studies';
import { getStoredFileByKey, insertStoredFile } from '../../../db/queries/files';
import type { FileStore, StoredObject } from './file-store';
import { createLocalFileStore } from './local-file-store';
import { detectImageType } from './image-type';
import { stripImageMetadata } from './strip-metadata';

export const MAX_IMAGE_BYTES = 2 * 1024 * 1024;

const localStores = new Map<string, FileStore>();

/** The injected store, or the local folder DATA_DIR/files. */
export function getFileStore(deps: AppDeps): FileStore {
  if (deps.storage) return deps.storage;
  const root = path.join(deps.env.DATA_DIR, 'files');
  let store = localStores.get(root);
  if (!store) localStores.set(root, (store = createLocalFileStore(root)));
  return store;
}

export async function uploadLevelImage(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  file: { buffer: Buffer; originalname: string },
) {
  await loadDraftStudy(deps, teamId, studyId, 'its attributes');
  const type = detectImageType(file.buffer);
  if (!type)
    throw new ValidationError(
      'Only PNG, JPEG or WebP images can be uploaded (checked from the file contents).',
      [{ path: 'file', message: 'Use a PNG, JPEG or WebP image' }],
      'unsupported_type',
    );
  const key = `${nanoid(24)}.${type.ext}`;
  // Photos carry camera, place and time: none of it reaches respondents.
  const bytes = await stripImageMetadata(file.buffer);
  await getFileStore(deps).put(key, bytes, type.contentType);
  const row = await insertStoredFile(deps.db, {
    teamId,
    studyId,
    storageKey: key,
    contentType: type.contentType,
    sizeBytes: bytes.length,
    originalName: file.originalname.slice(0, 200),
  });
  return {
    key: row.storageKey,
    url: `/api/files/${row.storageKey}`,
    contentType: row.contentType,
    sizeBytes: row.sizeBytes,
  };
}

export async function readPublicFile(deps: AppDeps, key: string): Promise<StoredObject> {
  const meta = await getStoredFileByKey(deps.db, { storageKey: key });
  if (!meta) throw new NotFoundError('File');
  const obj = await getFileStore(deps).get(key);
  if (!obj) throw new NotFoundError('File');
  return { bytes: obj.bytes, contentType: meta.contentType };
}
