import type { RequestHandler } from 'express';
import multer from 'multer';
import { HttpError } from './http-error.js';

/**
 * Reads one multipart file (field `file`) into memory, with a size limit. Over the limit answers 413, other
 * multipart faults 400. Small text fields (name, mapping) come along in req.body.
 */
export function singleFileUpload(limitBytes: number): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: limitBytes, files: 1, fields: 10, fieldSize: 64 * 1024, parts: 12 },
  }).single('file');
  const megabytes = Math.round((limitBytes / (1024 * 1024)) * 10) / 10;
  return (req, res, next) => {
    upload(req, res, (error?: unknown) => {
      if (!error) {
        if (!req.file) {
          next(new HttpError(400, 'invalid_body', 'Attach the recording as a CSV file in the field "file".', { file: 'Choose a CSV file.' }));
          return;
        }
        next();
        return;
      }
      if (error instanceof multer.MulterError) {
        if (error.code === 'LIMIT_FILE_SIZE') {
          const message = `The file is larger than the limit of ${megabytes} MB.`;
          next(new HttpError(413, 'payload_too_large', message, { file: message }));
        } else {
          next(new HttpError(400, 'invalid_body', `The upload could not be read: ${error.message}.`, { file: error.message }));
        }
        return;
      }
      next(error);
    });
  };
}
