import { createHash, randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import { fileTypeFromBuffer } from 'file-type';
import { stripImageMetadata } from '../storage/strip-image-metadata';
import { Op } from 'sequelize';
import type { SessionUser } from '../../shared/auth/schemas';
import { uploadField, uploadRules, type ConsentFormView, type PhotoView, type UploadKind, type UploadView } from '../../shared/uploads/uploads';
import { AppError } from '../errors';
import { Injury, Measurement, Upload } from '../models';
import { StoredFileMissing, type FileStorage } from '../storage';
import { findAthlete } from './athlete-service';
import { recordAudit } from './audit-service';
import { findInjury } from './injury-service';
import { staffNames } from './staff-names';

export interface IncomingFile {
  buffer: Buffer;
  originalname: string;
}

const kindWords: Record<string, string> = {
  'image/jpeg': 'a JPEG image',
  'image/png': 'a PNG image',
  'image/webp': 'a WebP image',
  'image/gif': 'a GIF image',
  'image/heic': 'an HEIC image',
  'image/tiff': 'a TIFF image',
  'application/pdf': 'a PDF document',
  'application/zip': 'a ZIP archive',
  'application/x-msdownload': 'a Windows program',
};

function refuse(message: string): AppError {
  return AppError.badRequest(message, { [uploadField]: message });
}

/**
 * What the bytes are, whatever the file is called or the browser claims: an .jpg that is really a PDF (or a
 * script) is refused before anything is stored.
 */
export async function checkFileType(kind: UploadKind, file: IncomingFile | undefined): Promise<string> {
  const rule = uploadRules[kind];
  if (!file) throw refuse(`Choose a file to upload: ${rule.describe}.`);
  if (file.buffer.length === 0) throw refuse('The file is empty.');
  const detected = await fileTypeFromBuffer(file.buffer);
  if (!detected || !rule.accepted.includes(detected.mime)) {
    const seen = detected ? (kindWords[detected.mime] ?? `a ${detected.ext.toUpperCase()} file`) : 'not a file type we recognise';
    throw refuse(`The ${rule.noun} must be ${rule.describe}; this file is ${seen}, whatever its name says.`);
  }
  return detected.mime;
}

/** A name safe to keep and to offer back in a download: no folders, no control characters. */
function cleanName(name: string): string | null {
  const base = name.split(/[\\/]/).pop() ?? '';
  const cleaned = base.replace(/[\u0000-\u001f\u007f"]/g, '').trim().slice(0, 255);
  return cleaned || null;
}


function toUploadView(upload: Upload, names: Map<string, string>): UploadView {
  return {
    id: upload.id,
    kind: upload.kind,
    contentType: upload.contentType,
    byteSize: upload.byteSize,
    originalName: upload.originalName,
    uploadedAt: upload.createdAt.toISOString(),
    uploadedByName: upload.uploadedBy ? (names.get(upload.uploadedBy) ?? null) : null,
    url: `/api/uploads/${upload.id}`,
  };
}

/** A measurement of the caller's clinic; any other is "not found". */
export async function findMeasurement(actor: SessionUser, id: string): Promise<Measurement> {
  const measurement = await Measurement.findOne({ where: { id, clinicId: actor.clinicId } });
  if (!measurement) throw AppError.notFound('Measurement');
  return measurement;
}

/** Bytes first, then the row: if the row cannot be written, the bytes are removed again, so nothing half-saved stays. */
async function store(
  actor: SessionUser,
  storage: FileStorage,
  kind: UploadKind,
  file: IncomingFile,
  contentType: string,
  links: { athleteId: string; injuryId: string | null; measurementId: string | null },
): Promise<Upload> {
  const key = `${actor.clinicId}/${randomUUID()}`;
  await storage.put(key, file.buffer, contentType);
  try {
    return await Upload.sequelize!.transaction(async (transaction) => {
      const upload = await Upload.create(
        {
          clinicId: actor.clinicId,
          kind,
          ...links,
          storageKey: key,
          contentType,
          byteSize: file.buffer.length,
          sha256: createHash('sha256').update(file.buffer).digest('hex'),
          originalName: cleanName(file.originalname),
          uploadedBy: actor.id,
        },
        { transaction },
      );
      await recordAudit(actor, `upload.${kind}`, { type: 'upload', id: upload.id }, { ...links, bytes: file.buffer.length }, transaction);
      return upload;
    });
  } catch (error) {
    await storage.delete(key).catch(() => undefined);
    throw error;
  }
}

export async function addMeasurementPhoto(actor: SessionUser, storage: FileStorage, measurementId: string, file: IncomingFile | undefined): Promise<PhotoView> {
  const measurement = await findMeasurement(actor, measurementId);
  const contentType = await checkFileType('measurement-photo', file);
  const injury = await Injury.findOne({ where: { id: measurement.injuryId, clinicId: actor.clinicId } });
  if (!injury) throw AppError.notFound('Measurement');
  let cleaned: Buffer;
  try {
    cleaned = await stripImageMetadata(file!.buffer, contentType);
  } catch {
    throw AppError.badRequest('The photo could not be read as an image.', { file: 'The file is damaged or not a complete image.' });
  }
  const upload = await store(actor, storage, 'measurement-photo', { ...file!, buffer: cleaned }, contentType, { athleteId: injury.athleteId, injuryId: injury.id, measurementId });
  return { ...toUploadView(upload, new Map([[actor.id, actor.name]])), measurementId, injuryId: injury.id, takenAt: measurement.takenAt.toISOString() };
}

export async function addConsentForm(actor: SessionUser, storage: FileStorage, athleteId: string, file: IncomingFile | undefined): Promise<ConsentFormView> {
  await findAthlete(actor, athleteId);
  const contentType = await checkFileType('consent-form', file);
  const upload = await store(actor, storage, 'consent-form', file!, contentType, { athleteId, injuryId: null, measurementId: null });
  return { ...toUploadView(upload, new Map([[actor.id, actor.name]])), athleteId };
}

/** An injury's photos in the order their measurements were taken, so change over time reads left to right. */
export async function listInjuryPhotos(actor: SessionUser, injuryId: string): Promise<PhotoView[]> {
  await findInjury(actor, injuryId);
  const uploads = await Upload.findAll({ where: { clinicId: actor.clinicId, injuryId, kind: 'measurement-photo' } });
  if (!uploads.length) return [];
  const measurements = await Measurement.findAll({
    where: { clinicId: actor.clinicId, id: { [Op.in]: [...new Set(uploads.map((u) => u.measurementId!))] } },
    attributes: ['id', 'takenAt'],
  });
  const takenAt = new Map(measurements.map((m) => [m.id, m.takenAt]));
  const names = await staffNames(uploads.map((u) => u.uploadedBy));
  return uploads
    .filter((u) => takenAt.has(u.measurementId!))
    .sort((a, b) => takenAt.get(a.measurementId!)!.getTime() - takenAt.get(b.measurementId!)!.getTime() || a.createdAt.getTime() - b.createdAt.getTime())
    .map((u) => ({ ...toUploadView(u, names), measurementId: u.measurementId!, injuryId, takenAt: takenAt.get(u.measurementId!)!.toISOString() }));
}

export async function listConsentForms(actor: SessionUser, athleteId: string): Promise<ConsentFormView[]> {
  await findAthlete(actor, athleteId);
  const uploads = await Upload.findAll({ where: { clinicId: actor.clinicId, athleteId, kind: 'consent-form' }, order: [['createdAt', 'DESC']] });
  const names = await staffNames(uploads.map((u) => u.uploadedBy));
  return uploads.map((u) => ({ ...toUploadView(u, names), athleteId }));
}

/** The file for signed-in staff of its clinic; for anyone else it does not exist. */
export async function openUpload(actor: SessionUser, storage: FileStorage, id: string): Promise<{ upload: Upload; stream: Readable }> {
  const upload = await Upload.findOne({ where: { id, clinicId: actor.clinicId } });
  if (!upload) throw AppError.notFound('File');
  try {
    return { upload, stream: await storage.get(upload.storageKey) };
  } catch (error) {
    if (error instanceof StoredFileMissing) throw AppError.notFound('File');
    throw error;
  }
}
