import type { ErrorRequestHandler } from 'express';
import { AppError } from '../errors';
import { logger } from '../logger';

/** The one place errors become HTTP: `{ error, issues? }`, never a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof AppError) {
    res.status(err.status).json(err.issues ? { error: err.message, issues: err.issues } : { error: err.message });
    return;
  }
  // body-parser and multer errors carry a status or a code of their own
  const status = typeof err?.status === 'number' ? err.status : typeof err?.statusCode === 'number' ? err.statusCode : 500;
  if (status === 413 || err?.code === 'LIMIT_FILE_SIZE') {
    res.status(413).json({ error: 'The upload is too large' });
    return;
  }
  if (err?.code === 'ENOENT') {
    // a file that went missing on disk: say so without the server's path
    res.status(404).json({ error: 'Not found' });
    return;
  }
  if (status >= 400 && status < 500) {
    res.status(status).json({ error: err?.type === 'entity.parse.failed' ? 'The request body is not valid JSON' : String(err?.message ?? 'Bad request') });
    return;
  }
  // the request's own logger carries its request id
  (req.log ?? logger).error({ err }, 'unexpected error');
  res.status(500).json({ error: 'Something went wrong on the server; the error was logged' });
};
