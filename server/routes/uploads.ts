import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { idParamsSchema } from '../../shared/ids';
import { megabyte, uploadField, uploadRules, type UploadKind } from '../../shared/uploads/uploads';
import { AppError } from '../errors';
import { currentUser, requireRole } from '../middleware/auth';
import { parseInput } from '../middleware/validate';
import type { FileStorage } from '../storage';
import { findAthlete } from '../services/athlete-service';
import { addConsentForm, addMeasurementPhoto, findMeasurement, listConsentForms, listInjuryPhotos, openUpload } from '../services/upload-service';

function refuse(message: string): AppError {
  return AppError.badRequest(message, { [uploadField]: message });
}

/** One file in memory, within the kind's size limit; multer's refusals become 400s that say what to change. */
function receive(kind: UploadKind): RequestHandler {
  const rule = uploadRules[kind];
  const parse = multer({ storage: multer.memoryStorage(), limits: { fileSize: rule.maxBytes, files: 1, fields: 5, parts: 6 } }).single(uploadField);
  return (req, res, next) => {
    parse(req, res, (error: unknown) => {
      if (!error) return next();
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') return next(refuse(`The ${rule.noun} is larger than ${rule.maxBytes / megabyte} MB.`));
        if (error.code === 'LIMIT_FILE_COUNT' || error.code === 'LIMIT_UNEXPECTED_FILE') {
          return next(refuse(`Send one file, in the form field "${uploadField}".`));
        }
        return next(refuse('The upload has more parts than a single file needs.'));
      }
      next(refuse('The upload did not arrive whole. Try again.'));
    });
  };
}

export function uploadRoutes(storage: FileStorage): Router {
  const router = Router();
  // Clinical records are for the people who treat and supervise (as for athletes and injuries).
  const clinical = requireRole('therapist', 'supervisor');

  // The record is looked up before the body is read, so a wrong id costs no upload.
  const measurementExists: RequestHandler = async (req, _res, next) => {
    const { id } = parseInput(idParamsSchema, req.params);
    await findMeasurement(currentUser(req), id);
    next();
  };
  const athleteExists: RequestHandler = async (req, _res, next) => {
    const { id } = parseInput(idParamsSchema, req.params);
    await findAthlete(currentUser(req), id);
    next();
  };

  router.post('/measurements/:id/photos', clinical, measurementExists, receive('measurement-photo'), async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.status(201).json({ photo: await addMeasurementPhoto(currentUser(req), storage, id, req.file) });
  });

  router.post('/athletes/:id/consent-form', clinical, athleteExists, receive('consent-form'), async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.status(201).json({ consentForm: await addConsentForm(currentUser(req), storage, id, req.file) });
  });

  router.get('/injuries/:id/photos', clinical, async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ items: await listInjuryPhotos(currentUser(req), id) });
  });

  router.get('/athletes/:id/consent-forms', clinical, async (req, res) => {
    const { id } = parseInput(idParamsSchema, req.params);
    res.json({ items: await listConsentForms(currentUser(req), id) });
  });

  // Any signed-in member of the clinic; anyone else gets the same 404 as for a file that does not exist.
  router.get('/uploads/:id', async (req, res, next) => {
    const { id } = parseInput(idParamsSchema, req.params);
    const { upload, stream } = await openUpload(currentUser(req), storage, id);
    const image = upload.contentType.startsWith('image/');
    res.setHeader('Content-Type', upload.contentType);
    res.setHeader('Content-Length', String(upload.byteSize));
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cache-Control', 'private, no-store');
    // Served bytes never run as a page of ours, whatever they contain.
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    if (image) res.setHeader('Content-Disposition', 'inline');
    else res.attachment(upload.originalName ?? `${upload.kind}-${upload.id}.pdf`);
    stream.on('error', (error) => (res.headersSent ? res.destroy(error) : next(error)));
    stream.pipe(res);
  });

  return router;
}
