import multer from 'multer';
import type { RequestHandler } from 'express';
import { badRequest, HttpError } from '../errors';

/** One file field of a multipart upload, and what the form may carry beside it. */
export interface UploadSpec {
  /** The form field holding the file. */
  field: string;
  /** Largest file accepted, bytes. */
  maxBytes: number;
  /** Text fields allowed beside the file. */
  fields: number;
  /** Largest text field, bytes. */
  fieldBytes: number;
  /** What the file is, for messages ("photo", "CSV file"). */
  what: string;
}

const mb = (bytes: number) => `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MB`;

/**
 * Receives one file with multer into memory (no temporary file is ever written, so nothing is
 * left behind when a limit stops the upload), with limits on the file's size, the number of
 * files, parts and fields, and each field's size. A file over the limit is refused with 413
 * and a message giving the limit; other breaches with 400 naming the field. The file's name
 * and declared type are ignored; callers check the content.
 */
export function receiveFile(spec: UploadSpec): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: spec.maxBytes, files: 1, fields: spec.fields, parts: spec.fields + 1, fieldSize: spec.fieldBytes, fieldNameSize: 100, headerPairs: 50 },
  }).single(spec.field);
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) return next(badRequest(`Send the ${spec.what} as multipart/form-data in the field "${spec.field}".`, [{ path: spec.field, message: 'required' }]));
    upload(req, res, (err?: unknown) => {
      if (!err) {
        if (!req.file) return next(badRequest(`No ${spec.what} received: send it in the field "${spec.field}".`, [{ path: spec.field, message: 'required' }]));
        return next();
      }
      if (err instanceof multer.MulterError) {
        switch (err.code) {
          case 'LIMIT_FILE_SIZE':
            return next(new HttpError(413, 'too_large', `The ${spec.what} is larger than ${mb(spec.maxBytes)}; nothing was stored.`, [{ path: spec.field, message: `at most ${mb(spec.maxBytes)}` }]));
          case 'LIMIT_UNEXPECTED_FILE':
          case 'LIMIT_FILE_COUNT':
            return next(badRequest(`Send exactly one file, in the field "${spec.field}".`, [{ path: err.field ?? spec.field, message: 'unexpected file' }]));
          case 'LIMIT_FIELD_VALUE':
            return next(badRequest(`The field "${err.field}" is too long.`, [{ path: err.field ?? '(form)', message: `at most ${spec.fieldBytes} bytes` }]));
          default:
            return next(badRequest(`The form has too many parts or fields (${err.code}).`, [{ path: '(form)', message: err.message }]));
        }
      }
      // busboy's parse errors (a malformed multipart body) are the client's.
      return next(badRequest(`The upload could not be read: ${(err as Error).message ?? 'malformed form'}.`, [{ path: '(form)', message: 'malformed multipart body' }]));
    });
  };
}
