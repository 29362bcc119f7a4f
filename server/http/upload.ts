// One file uploaded as multipart/form-data in the field "file", held in memory under a byte cap;
// multer's own errors become clear 4xx answers.
import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from './errors';

export type UploadRule = {
  /** What the upload is, in the messages: "file" or "archive". */
  what: string;
  maxBytes: number;
  limits: { fields: number; parts: number; fieldSize?: number };
  /** Name the form field multer refused, when it says which. */
  nameField?: boolean;
  /** The answer when the body is not multipart multer can read (other errors than multer's own). */
  unreadable?: string;
};

export function singleFileUpload(rule: UploadRule): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: rule.maxBytes, files: 1, ...rule.limits },
  }).single('file');
  return (req, res, next) => {
    if (!req.is('multipart/form-data')) {
      next(
        new HttpError(
          415,
          'unsupported_media_type',
          `Send the ${rule.what} as multipart/form-data with the field "file"`,
        ),
      );
      return;
    }
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE')
          return next(
            new HttpError(
              413,
              'file_too_large',
              `The ${rule.what} is larger than the ${rule.maxBytes / 1024 / 1024} MB limit`,
            ),
          );
        const field = rule.nameField && err.field ? ` (${err.field})` : '';
        return next(new HttpError(400, 'bad_upload', `Upload refused: ${err.message}${field}`));
      }
      next(new HttpError(400, 'bad_upload', rule.unreadable ?? `Upload refused: ${(err as Error).message}`));
    });
  };
}
