import sharp from 'sharp';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../server/config';
import { createStorage, StoredFileMissing, type FileStorage } from '../../server/storage';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';
import { startFakeS3 } from '../support/s3-server';

const s3 = await startFakeS3();
const app = buildTestApp(s3.env);
let storage: FileStorage;

const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

async function readAll(stream: NodeJS.ReadableStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.from(chunk as Buffer));
  return Buffer.concat(chunks);
}

beforeAll(() => {
  storage = createStorage(loadConfig({ ...process.env, ...s3.env }).storage);
});

afterAll(async () => {
  await s3.stop();
});

describe('the S3 storage driver against a local fake S3 (s3rver)', () => {
  it('puts, streams back and deletes an object; a deleted key is missing', async () => {
    expect(storage.driver).toBe('s3');
    const key = `${randomUUID()}/${randomUUID()}`;
    const bytes = Buffer.from(`bytes ${randomUUID()}`);
    await storage.put(key, bytes, 'application/octet-stream');
    expect(Buffer.compare(await readAll(await storage.get(key)), bytes)).toBe(0);
    await storage.delete(key);
    await expect(storage.get(key)).rejects.toBeInstanceOf(StoredFileMissing);
  });

  it('refuses a key that is not ours, so no request can reach another prefix', async () => {
    await expect(storage.put('../other/file', png, 'image/png')).rejects.toThrow(RangeError);
  });

  it('serves an uploaded photo from the bucket to staff of the clinic, and to no one else', async () => {
    const clinic = await createClinic();
    const therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
    const stranger = await signedInAgent(app, (await createStaff((await createClinic()).id, 'therapist')).email);
    const athleteId = (await therapist.post('/api/athletes').send({ name: 'Ines Harrow', yearOfBirth: 2002, sport: 'Netball' })).body.athlete.id;
    const injuryId = (
      await therapist.post('/api/injuries').send({ athleteId, region: 'forearm', side: 'left', mechanismKind: 'ball', injuredAt: new Date(Date.now() - 7_200_000).toISOString() })
    ).body.injury.id;
    const measurementId = (await therapist.post(`/api/injuries/${injuryId}/measurements`).send({ takenAt: new Date().toISOString(), painNprs: 4 })).body.measurement.id;

    const { photo } = (await therapist.post(`/api/measurements/${measurementId}/photos`).attach('file', png, 'forearm.png').expect(201)).body;
    const res = await therapist.get(photo.url).buffer(true);
    expect(res.headers['content-type']).toBe('image/png');
    // What the bucket holds is the photo re-encoded without metadata: the same 1×1 picture, the stored size.
    const served = res.body as Buffer;
    expect(served.length).toBe(photo.byteSize);
    const meta = await sharp(served).metadata();
    expect([meta.format, meta.width, meta.height]).toEqual(['png', 1, 1]);
    expect((await stranger.get(photo.url)).status).toBe(404);
  });
});
