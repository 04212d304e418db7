import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import { HttpError } from '../lib/http-error.js';
import { PHOTO_LIMITS } from '../../src/schemas/journal.js';

// Photo uploads: multipart field "photos", held in memory (at most 8 × 15 MB per request) because every file
// is re-encoded anyway and nothing a person sent is ever written to disk as is.

const MB = 1024 * 1024;

const parser = multer({
  storage: multer.memoryStorage(),
  // Browsers send UTF-8 file names; busboy's latin1 default would garble "Körper.jpg" in our messages.
  defParamCharset: 'utf8',
  limits: {
    fileSize: PHOTO_LIMITS.maxFileBytes,
    files: PHOTO_LIMITS.maxFiles,
    fields: 10,
    fieldSize: 64 * 1024,
    parts: PHOTO_LIMITS.maxFiles + 10,
  },
}).array('photos', PHOTO_LIMITS.maxFiles);

const quoted = (n?: string) => (n ? `“${n}”` : 'A file');

function toHttpError(err: unknown): HttpError {
  if (err instanceof multer.MulterError) {
    const e = err as multer.MulterError & { filename?: string };
    switch (e.code) {
      case 'LIMIT_FILE_SIZE':
        return new HttpError(413, `${quoted(e.filename)} is larger than ${PHOTO_LIMITS.maxFileBytes / MB} MB. Choose a smaller copy of the photo.`);
      case 'LIMIT_FILE_COUNT':
        return new HttpError(413, `You can add at most ${PHOTO_LIMITS.maxFiles} photos at a time; this upload had more. Send them in smaller groups.`);
      case 'LIMIT_UNEXPECTED_FILE':
        // multer also reports an array over its maxCount with this code, for the right field name.
        return e.field === 'photos'
          ? new HttpError(413, `You can add at most ${PHOTO_LIMITS.maxFiles} photos at a time; this upload had more. Send them in smaller groups.`)
          : new HttpError(400, `Send photos in the form field "photos" (this upload used "${e.field ?? ''}").`);
      case 'LIMIT_PART_COUNT':
      case 'LIMIT_FIELD_COUNT':
        return new HttpError(413, 'This upload has too many parts. Send only the photos.');
      default:
        return new HttpError(400, 'This upload could not be read. Please choose the photos again.');
    }
  }
  // busboy's own errors: a form cut off mid-way, a wrong boundary, a broken part header.
  return new HttpError(400, 'The upload arrived incomplete or garbled. Check your connection and try again.');
}

/** Parses the "photos" files into req.files, or answers in the one error shape. */
export function photoUpload(req: Request, res: Response, next: NextFunction) {
  if (!req.is('multipart/form-data')) {
    next(new HttpError(415, 'Send photos as a multipart form (multipart/form-data) with the field "photos".'));
    return;
  }
  parser(req, res, (err?: unknown) => {
    if (!err) return next();
    // Read and drop the rest of the body, so the client finishes sending and can read our answer
    // instead of seeing its connection reset.
    req.unpipe();
    req.resume();
    next(toHttpError(err));
  });
}

export function uploadedFiles(req: Request): Express.Multer.File[] {
  return Array.isArray(req.files) ? req.files : [];
}
