import type { StorageConfig } from '../config';
import { localFolderStorage } from './local-storage';
import { s3Storage } from './s3-storage';
import type { FileStorage } from './storage';

export type { FileStorage } from './storage';
export { StoredFileMissing } from './storage';

export function createStorage(config: StorageConfig): FileStorage {
  return config.driver === 's3' ? s3Storage(config) : localFolderStorage(config.dir);
}
