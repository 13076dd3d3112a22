/**
 * Where uploaded bytes live (never in the database). The default keeps them in a local
 * folder; a cloud object store can implement the same interface and be injected in AppDeps.
 */
export interface StoredObject {
  bytes: Buffer;
  contentType: string;
}

export interface FileStore {
  put(key: string, bytes: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<StoredObject | null>;
  remove(key: string): Promise<void>;
}
