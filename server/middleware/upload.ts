import multer from 'multer';
import type { RequestHandler } from 'express';
import { AppError } from '../errors';
import type { Config } from '../config';
import { CAPTURE_LIMIT_BYTES } from '../services/attachments';
import { storagePaths } from '../storage';

/** One multipart field `file`, written to DATA_DIR/uploads/incoming (never held whole in memory). */
export function singleUpload(config: Config): RequestHandler {
  const upload = multer({
    dest: storagePaths(config).incomingDir,
    // browsers send the file name as UTF-8 bytes; busboy would read them as Latin-1
    defParamCharset: 'utf8',
    limits: { fileSize: CAPTURE_LIMIT_BYTES, files: 1, fields: 10 },
  }).single('file');
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError('too_large', 'Uploads are limited to 10 MB for screenshots and 50 MB for captures'));
        return next(new AppError('invalid_input', `Upload refused: ${err.message}`));
      }
      if (err) return next(err);
      if (!req.file) return next(new AppError('invalid_input', 'Send the file in a multipart field named "file"'));
      next();
    });
}
