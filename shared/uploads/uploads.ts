/** What may be uploaded, how large, and the shapes the API answers with. */

export const uploadKinds = ['measurement-photo', 'consent-form'] as const;
export type UploadKind = (typeof uploadKinds)[number];

export const megabyte = 1024 * 1024;

export interface UploadRule {
  /** MIME types recognised from the file's bytes (never from its name or the browser's claim). */
  accepted: readonly string[];
  maxBytes: number;
  /** For messages: "a JPEG, PNG or WebP image". */
  describe: string;
  noun: string;
}

export const uploadRules: Record<UploadKind, UploadRule> = {
  'measurement-photo': {
    accepted: ['image/jpeg', 'image/png', 'image/webp'],
    maxBytes: 8 * megabyte,
    describe: 'a JPEG, PNG or WebP image',
    noun: 'photo',
  },
  'consent-form': {
    accepted: ['application/pdf'],
    maxBytes: 10 * megabyte,
    describe: 'a PDF document',
    noun: 'consent form',
  },
};

/** The multipart field that carries the file. */
export const uploadField = 'file';

export interface UploadView {
  id: string;
  kind: UploadKind;
  contentType: string;
  byteSize: number;
  originalName: string | null;
  uploadedAt: string;
  uploadedByName: string | null;
  /** Where signed-in staff of the clinic fetch the file. */
  url: string;
}

export interface PhotoView extends UploadView {
  measurementId: string;
  injuryId: string;
  /** The measurement's time: photos are ordered and grouped by it, so change over time is visible. */
  takenAt: string;
}

export interface ConsentFormView extends UploadView {
  athleteId: string;
}
