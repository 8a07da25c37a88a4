import pino, { type DestinationStream, type Logger } from 'pino';

export type { Logger } from 'pino';

const LEVELS = ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'];

/**
 * LOG_LEVEL when set; otherwise info, and silent inside vitest so test output stays readable (a
 * test that wants the lines passes its own logger). The server entry point passes
 * `quietUnderTest: false`: a server a test spawns must still say where it listens.
 */
export function logLevelFrom(env: NodeJS.ProcessEnv = process.env, quietUnderTest = true): string {
  const asked = env.LOG_LEVEL?.trim().toLowerCase();
  if (asked) {
    if (!LEVELS.includes(asked)) throw new Error(`LOG_LEVEL must be one of ${LEVELS.join(', ')}; got "${env.LOG_LEVEL}"`);
    return asked;
  }
  return quietUnderTest && env.VITEST ? 'silent' : 'info';
}

/**
 * One JSON object per line on stdout (or `destination`). The redaction is a second line of
 * defence: the request log never binds headers or bodies in the first place.
 */
export function createLogger(options: { level?: string; destination?: DestinationStream } = {}): Logger {
  return pino(
    {
      level: options.level ?? logLevelFrom(),
      base: { app: 'falsetrace' },
      timestamp: pino.stdTimeFunctions.isoTime,
      redact: {
        paths: ['req.headers.cookie', 'req.headers.authorization', 'req.headers["x-csrf-token"]', 'res.headers["set-cookie"]', '*.password', '*.token', '*.sessionId'],
        censor: '[redacted]',
      },
    },
    options.destination,
  );
}

/** The process's logger: start-up, the mail queue, errors outside a request. */
export const logger = createLogger();
