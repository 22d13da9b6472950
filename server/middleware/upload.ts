import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from '../http/errors';

/**
 * Accepts one file in the form field "file", held in memory (never written where the web server
 * serves files); larger than `maxBytes` is a 413, anything else multer refuses is a 400.
 */
export function singleFileUpload(maxBytes: number): RequestHandler {
  const handle = multer({ storage: multer.memoryStorage(), limits: { fileSize: maxBytes, files: 1, fields: 10, fieldSize: 1000 } }).single('file');
  return (req, res, next) => {
    handle(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(new HttpError(413, 'too_large', `The file is larger than ${Math.round(maxBytes / 1024 / 1024)} MB`));
        }
        return next(new HttpError(400, 'bad_request', `The upload could not be read: ${err.message}`));
      }
      next(err);
    });
  };
}
