import multer from 'multer';
import type { RequestHandler } from 'express';
import { AppError } from '../errors';
import { DEFAULT_CAPTURE_LIMIT_BYTES, type Config } from '../config';
import { storagePaths } from '../storage';
import { imageLimitedStorage, markNamedImages } from './image-limited-storage';

/** The capture limit in words: "2 GB", "1.5 MB". */
export function sizeInWords(bytes: number): string {
  const [unit, size] = bytes >= 1024 ** 3 ? ['GB', 1024 ** 3] : bytes >= 1024 ** 2 ? ['MB', 1024 ** 2] : ['KB', 1024];
  return `${Number((bytes / size).toFixed(1))} ${unit}`;
}

/**
 * One multipart field `file`, streamed to DATA_DIR/uploads/incoming (never held in memory),
 * up to the capture limit (`CAPTURE_LIMIT_BYTES`). A picture (by name, declared type or first
 * bytes) is held to the screenshot limit as it arrives, so it never fills the disk up to the
 * capture limit before being refused.
 */
export function singleUpload(config: Config): RequestHandler {
  const limitBytes = config.captureLimitBytes ?? DEFAULT_CAPTURE_LIMIT_BYTES;
  const upload = multer({
    storage: imageLimitedStorage(storagePaths(config).incomingDir),
    fileFilter: markNamedImages,
    // browsers send the file name as UTF-8 bytes; busboy would read them as Latin-1
    defParamCharset: 'utf8',
    limits: { fileSize: limitBytes, files: 1, fields: 10 },
  }).single('file');
  return (req, res, next) =>
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError('too_large', `The file is larger than the ${sizeInWords(limitBytes)} upload limit for captures (screenshots: 10 MB)`));
        return next(new AppError('invalid_input', `Upload refused: ${err.message}`));
      }
      if (err) return next(err);
      if (!req.file) return next(new AppError('invalid_input', 'Send the file in a multipart field named "file"'));
      next();
    });
}
