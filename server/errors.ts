/** Typed application errors; the error middleware turns each into `{ error, issues? }`. */
export type ErrorCode =
  | 'invalid_input'
  | 'unauthenticated'
  | 'forbidden'
  | 'csrf'
  | 'not_found'
  | 'conflict'
  | 'too_large'
  | 'unsupported_type'
  | 'rate_limited'
  | 'unavailable'
  | 'gone';

const STATUS: Record<ErrorCode, number> = {
  invalid_input: 400,
  unauthenticated: 401,
  forbidden: 403,
  csrf: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  too_large: 413,
  unsupported_type: 415,
  rate_limited: 429,
  unavailable: 503,
};

export interface Issue {
  path: string;
  message: string;
}

export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly issues?: Issue[],
  ) {
    super(message);
    this.status = STATUS[code];
  }
}

export const notFound = (what = 'Not found') => new AppError('not_found', what);
export const forbidden = (why = 'You may not do that') => new AppError('forbidden', why);
export const invalid = (message: string, issues?: Issue[]) => new AppError('invalid_input', message, issues);
