import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import exifr from 'exifr';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const storageDir = fs.mkdtempSync(path.join(os.tmpdir(), 'mendstep-uploads-meta-'));
const app = buildTestApp({ STORAGE_DIR: storageDir });
afterAll(() => fs.rmSync(storageDir, { recursive: true, force: true }));

let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let measurementId: string;

beforeAll(async () => {
  const clinic = await createClinic();
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
  const athleteId = (await therapist.post('/api/athletes').send({ name: 'Ada Quell', yearOfBirth: 1995, sport: 'Netball' })).body.athlete.id;
  const injuryId = (
    await therapist.post('/api/injuries').send({ athleteId, region: 'calf', side: 'left', mechanismKind: 'ball', injuredAt: new Date(Date.now() - 86_400_000).toISOString() })
  ).body.injury.id;
  measurementId = (await therapist.post(`/api/injuries/${injuryId}/measurements`).send({ takenAt: new Date(Date.now() - 3_600_000).toISOString(), painNprs: 4 })).body.measurement.id;
});

/** A photo as a phone writes it: EXIF with the camera and a GPS position (51.5° N, 0.1167° W). */
async function photoWithLocation(format: 'jpeg' | 'webp' | 'png') {
  return sharp({ create: { width: 40, height: 30, channels: 3, background: '#8a3b3b' } })
    [format]()
    .withExif({ IFD0: { Make: 'PhoneCam' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' } })
    .toBuffer();
}

describe('photo metadata', () => {
  for (const format of ['jpeg', 'webp', 'png'] as const) {
    it(`stores a ${format.toUpperCase()} photo without its GPS position or camera tags`, async () => {
      const original = await photoWithLocation(format);
      // The fixture really carries EXIF with a location, or the checks below would prove nothing.
      expect((await sharp(original).metadata()).exif).toBeDefined();
      // exifr reads JPEG and PNG, not WebP.
      if (format !== 'webp') expect((await exifr.gps(original))?.latitude).toBeCloseTo(51.5, 3);

      const res = await therapist.post(`/api/measurements/${measurementId}/photos`).attach('file', original, { filename: `bruise.${format}`, contentType: `image/${format}` });
      expect(res.status).toBe(201);
      const stored = await therapist.get(`/api/uploads/${res.body.photo.id}`).buffer(true).parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
      expect(stored.status).toBe(200);
      const bytes = stored.body as Buffer;
      expect((await sharp(bytes).metadata()).exif).toBeUndefined();
      if (format !== 'webp') expect(await exifr.gps(bytes)).toBeUndefined();
      // Still the same picture.
      expect((await sharp(bytes).metadata()).width).toBe(40);
    });
  }
});
