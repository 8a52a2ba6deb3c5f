import type { Readable } from 'node:stream';

/** Where uploaded bytes live. Keys are made by the server (`clinicId/uuid`), never taken from a request. */
export interface FileStorage {
  readonly driver: 'local' | 's3';
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  /** A stream of the stored bytes; throws StoredFileMissing when there is nothing under the key. */
  get(key: string): Promise<Readable>;
  /** Removing a key that is already gone is not an error. */
  delete(key: string): Promise<void>;
}

export class StoredFileMissing extends Error {
  constructor(readonly key: string) {
    super(`No stored file under ${key}`);
  }
}

const keyPattern = /^[0-9a-f-]{36}\/[0-9a-f-]{36}$/;

/** Both drivers refuse anything but our own key shape, so no key can climb out of its folder or bucket prefix. */
export function assertStorageKey(key: string): void {
  if (!keyPattern.test(key)) throw new RangeError(`Not a storage key: ${key}`);
}
