import type { RequestHandler } from 'express';
import multer from 'multer';
import { AppError } from './app-error.js';

/** One route's upload: a single file in one multipart field, held in memory. */
export interface FileUpload {
  /** The multipart field that carries the file. */
  field: string;
  /** The largest file accepted, in bytes; a larger one is a 413. */
  maxBytes: number;
  /** How many text fields and parts (text and file) a body may hold at most. */
  fields: number;
  parts: number;
  /** What the file is, for messages: "the photo", "the CSV". */
  what: string;
  /** The 413 detail, saying what to do instead. */
  tooLarge: string;
  /** The detail when a body holds more files, or a file under another field; multer's own words when unset. */
  oneFile?: string;
}

/**
 * multer in memory (no temporary files) for one file; anything but multipart/form-data is a 415,
 * and every multer refusal becomes an AppError, so it reaches the problem+json middleware.
 */
export function receiveOneFile(upload: FileUpload): RequestHandler {
  const read = multer({ storage: multer.memoryStorage(), limits: { fileSize: upload.maxBytes, files: 1, fields: upload.fields, parts: upload.parts } }).single(upload.field);
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) {
      return next(new AppError(415, 'Unsupported media type', `Send ${upload.what} as multipart/form-data in the field "${upload.field}".`, undefined, 'unsupported-media-type'));
    }
    read(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'Payload too large', upload.tooLarge, undefined, 'too-large'));
        const detail = err.code === 'LIMIT_UNEXPECTED_FILE' && upload.oneFile ? upload.oneFile : `The upload was refused: ${err.message}.`;
        return next(AppError.badRequest(detail, [{ field: err.field ?? upload.field, message: err.message }]));
      }
      next(AppError.badRequest('The upload could not be read (a broken multipart body).'));
    });
  };
}
