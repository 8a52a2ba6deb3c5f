import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Upload } from '../../server/models';
import { buildTestApp, createClinic, createStaff, signedInAgent } from '../support/api-app';

const storageDir = fs.mkdtempSync(path.join(os.tmpdir(), 'mendstep-uploads-'));
const app = buildTestApp({ STORAGE_DIR: storageDir });
afterAll(() => fs.rmSync(storageDir, { recursive: true, force: true }));

// Small real images of each kind, made by an image library (a hand-written 1×1 JPEG is not always decodable).
const tiny = (format: 'png' | 'jpeg' | 'webp') => sharp({ create: { width: 2, height: 2, channels: 3, background: '#aa3344' } })[format]().toBuffer();
let png: Buffer;
let jpeg: Buffer;
let webp: Buffer;
const pdf = Buffer.from('%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n');

let therapist: Awaited<ReturnType<typeof signedInAgent>>;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
let otherClinic: Awaited<ReturnType<typeof signedInAgent>>;
let athleteId: string;
let injuryId: string;
let early: string;
let late: string;

const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000).toISOString();
const storedFiles = () => fs.readdirSync(storageDir, { recursive: true, withFileTypes: true }).filter((d) => d.isFile()).length;

beforeAll(async () => {
  [png, jpeg, webp] = await Promise.all([tiny('png'), tiny('jpeg'), tiny('webp')]);
  const clinic = await createClinic();
  const other = await createClinic();
  therapist = await signedInAgent(app, (await createStaff(clinic.id, 'therapist')).email);
  admin = await signedInAgent(app, (await createStaff(clinic.id, 'admin')).email);
  otherClinic = await signedInAgent(app, (await createStaff(other.id, 'therapist')).email);
  athleteId = (await therapist.post('/api/athletes').send({ name: 'Tomasz Elwood', yearOfBirth: 1997, sport: 'Hockey' })).body.athlete.id;
  injuryId = (await therapist.post('/api/injuries').send({ athleteId, region: 'calf', side: 'right', mechanismKind: 'stick-or-bat', injuredAt: hoursAgo(96) })).body.injury.id;
  early = (await therapist.post(`/api/injuries/${injuryId}/measurements`).send({ takenAt: hoursAgo(90), painNprs: 6 })).body.measurement.id;
  late = (await therapist.post(`/api/injuries/${injuryId}/measurements`).send({ takenAt: hoursAgo(2), painNprs: 3 })).body.measurement.id;
});

describe('bruise photos', () => {
  it('stores a JPEG, PNG or WebP on a measurement and lists them in the order the measurements were taken', async () => {
    // Uploaded out of order: the later measurement's photo first.
    const first = await therapist.post(`/api/measurements/${late}/photos`).attach('file', png, { filename: 'day-4.png', contentType: 'image/png' });
    expect(first.status).toBe(201);
    expect(first.body.photo).toMatchObject({ measurementId: late, injuryId, contentType: 'image/png', originalName: 'day-4.png' });
    // Re-encoded without metadata before storing, so the size is the cleaned file's.
    expect(first.body.photo.byteSize).toBeGreaterThan(0);
    await therapist.post(`/api/measurements/${early}/photos`).attach('file', jpeg, { filename: 'day-1.jpg', contentType: 'image/jpeg' }).expect(201);
    await therapist.post(`/api/measurements/${late}/photos`).attach('file', webp, { filename: 'day-4b.webp', contentType: 'image/webp' }).expect(201);

    const list = await therapist.get(`/api/injuries/${injuryId}/photos`);
    expect(list.body.items.map((p: { measurementId: string; contentType: string }) => [p.measurementId, p.contentType])).toEqual([
      [early, 'image/jpeg'],
      [late, 'image/png'],
      [late, 'image/webp'],
    ]);
  });

  it('serves a photo only to signed-in staff of the same clinic, inline, with its stored type and nosniff', async () => {
    const { photo } = (await therapist.post(`/api/measurements/${early}/photos`).attach('file', png, 'bruise.png')).body;
    const res = await therapist.get(photo.url).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/png');
    expect(res.headers['content-disposition']).toBe('inline');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(Buffer.compare(res.body as Buffer, png)).toBe(0);
    // Any signed-in member of the clinic may open it.
    expect((await admin.get(photo.url)).status).toBe(200);

    const foreign = await otherClinic.get(photo.url);
    expect(foreign.status).toBe(404);
    expect((await request(app).get(photo.url)).status).toBe(401);
    expect((await otherClinic.get(`/api/injuries/${injuryId}/photos`)).status).toBe(404);
    expect((await otherClinic.post(`/api/measurements/${early}/photos`).attach('file', png, 'x.png')).status).toBe(404);
  });

  it('refuses a renamed non-image (a PDF called .jpg, sent as image/jpeg) with the reason, and stores nothing', async () => {
    const rowsBefore = await Upload.count();
    const filesBefore = storedFiles();
    const res = await therapist.post(`/api/measurements/${early}/photos`).attach('file', pdf, { filename: 'bruise.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toBe('The photo must be a JPEG, PNG or WebP image; this file is a PDF document, whatever its name says.');
    const script = await therapist.post(`/api/measurements/${early}/photos`).attach('file', Buffer.from('<svg onload="alert(1)"></svg>'), { filename: 'bruise.png', contentType: 'image/png' });
    expect(script.status).toBe(400);
    expect(script.body.error.fields.file).toContain('not a file type we recognise');
    expect(await Upload.count()).toBe(rowsBefore);
    expect(storedFiles()).toBe(filesBefore);
  });

  it('refuses a photo over 8 MB, an empty body and a missing file, naming the field', async () => {
    const big = Buffer.concat([png, Buffer.alloc(8 * 1024 * 1024)]);
    const tooBig = await therapist.post(`/api/measurements/${early}/photos`).attach('file', big, 'huge.png');
    expect(tooBig.status).toBe(400);
    expect(tooBig.body.error.fields.file).toBe('The photo is larger than 8 MB.');
    const none = await therapist.post(`/api/measurements/${early}/photos`).field('note', 'no file');
    expect(none.status).toBe(400);
    expect(none.body.error.fields.file).toMatch(/Choose a file/);
    const wrongField = await therapist.post(`/api/measurements/${early}/photos`).attach('photo', png, 'x.png');
    expect(wrongField.status).toBe(400);
    expect(wrongField.body.error.fields).toHaveProperty('file');
    expect((await therapist.post('/api/measurements/not-a-uuid/photos').attach('file', png, 'x.png')).status).toBe(400);
  });
});

describe('consent forms', () => {
  it('keeps a signed PDF on the athlete, lists it, and serves it as a download', async () => {
    const res = await therapist.post(`/api/athletes/${athleteId}/consent-form`).attach('file', pdf, { filename: 'consent signed.pdf', contentType: 'application/pdf' });
    expect(res.status).toBe(201);
    const list = await therapist.get(`/api/athletes/${athleteId}/consent-forms`);
    expect(list.body.items).toEqual([expect.objectContaining({ id: res.body.consentForm.id, contentType: 'application/pdf', originalName: 'consent signed.pdf' })]);
    const file = await therapist.get(res.body.consentForm.url).buffer(true);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(file.headers['content-disposition']).toMatch(/^attachment; filename="consent signed.pdf"/);
    expect(file.headers['x-content-type-options']).toBe('nosniff');
    expect((await otherClinic.get(res.body.consentForm.url)).status).toBe(404);
    expect((await otherClinic.get(`/api/athletes/${athleteId}/consent-forms`)).status).toBe(404);
  });

  it('refuses an image sent as a consent form, and a PDF over 10 MB', async () => {
    const image = await therapist.post(`/api/athletes/${athleteId}/consent-form`).attach('file', jpeg, { filename: 'consent.pdf', contentType: 'application/pdf' });
    expect(image.status).toBe(400);
    expect(image.body.error.fields.file).toContain('is a JPEG image');
    const big = await therapist.post(`/api/athletes/${athleteId}/consent-form`).attach('file', Buffer.concat([pdf, Buffer.alloc(10 * 1024 * 1024)]), 'big.pdf');
    expect(big.status).toBe(400);
    expect(big.body.error.fields.file).toBe('The consent form is larger than 10 MB.');
  });
});
