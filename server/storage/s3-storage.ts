import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import type { Readable } from 'node:stream';
import type { StorageConfig } from '../config';
import { assertStorageKey, StoredFileMissing, type FileStorage } from './storage';

type S3Settings = Extract<StorageConfig, { driver: 's3' }>;

/** An S3-compatible bucket through @aws-sdk/client-s3 (AWS, or a compatible service at S3_ENDPOINT). */
export function s3Storage(settings: S3Settings): FileStorage {
  const client = new S3Client({
    region: settings.region,
    ...(settings.endpoint ? { endpoint: settings.endpoint } : {}),
    forcePathStyle: settings.forcePathStyle,
    ...(settings.accessKeyId && settings.secretAccessKey
      ? { credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey } }
      : {}),
    // Current SDKs add CRC checksums to every request; many S3-compatible services reject or ignore them.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = settings.bucket;
  return {
    driver: 's3',
    async put(key, body, contentType) {
      assertStorageKey(key);
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.length }));
    },
    async get(key) {
      assertStorageKey(key);
      try {
        const result = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        if (!result.Body) throw new StoredFileMissing(key);
        return result.Body as Readable;
      } catch (error) {
        if (error instanceof NoSuchKey || (error instanceof S3ServiceException && error.$metadata.httpStatusCode === 404)) {
          throw new StoredFileMissing(key);
        }
        throw error;
      }
    },
    async delete(key) {
      assertStorageKey(key);
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
  };
}
