import fsp from 'node:fs/promises';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import { assertStorageKey, StoredFileMissing, type FileStorage } from './storage';

/** Files in a local folder (default .data/uploads, git-ignored): one folder per clinic. */
export function localFolderStorage(root: string): FileStorage {
  const fileFor = (key: string) => {
    assertStorageKey(key);
    return path.join(root, key);
  };
  return {
    driver: 'local',
    async put(key, body) {
      const file = fileFor(key);
      await fsp.mkdir(path.dirname(file), { recursive: true });
      // Written beside and renamed into place, so a reader never sees half a file.
      const partial = `${file}.${randomUUID()}.partial`;
      await fsp.writeFile(partial, body, { flag: 'wx' });
      await fsp.rename(partial, file);
    },
    async get(key): Promise<Readable> {
      const file = fileFor(key);
      try {
        const handle = await fsp.open(file, 'r');
        return handle.createReadStream();
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code === 'ENOENT') throw new StoredFileMissing(key);
        throw error;
      }
    },
    async delete(key) {
      await fsp.rm(fileFor(key), { force: true });
    },
  };
}

