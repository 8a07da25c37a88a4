import { z } from 'zod';

/** Widest plot the trace endpoint decimates for; beyond this the response only grows, the picture does not. */
export const MAX_TRACE_COLUMNS = 8000;

const seconds = (what: string) =>
  z.coerce
    .number({ error: `${what} must be a time in seconds` })
    .refine(Number.isFinite, `${what} must be a finite time in seconds`)
    .optional();

/**
 * `GET /api/attachments/:id/trace` query: how many pixel columns the plot has and, for a zoomed
 * view, the time window in seconds. Query strings arrive as text, hence the coercion.
 */
export const traceQuerySchema = z
  .object({
    columns: z.coerce
      .number({ error: 'columns must be a whole number of pixel columns' })
      .int('columns must be a whole number of pixel columns')
      .min(1, 'columns must be at least 1')
      .max(MAX_TRACE_COLUMNS, `columns must be at most ${MAX_TRACE_COLUMNS}`)
      .default(1000),
    fromS: seconds('fromS'),
    toS: seconds('toS'),
    /** Which channel, 1-based among the capture's signal columns (default 1). */
    channel: z.coerce.number({ error: 'channel must be a channel number' }).int('channel must be a whole number').min(1, 'channels are numbered from 1').optional(),
  })
  .refine((q) => q.fromS === undefined || q.toS === undefined || q.fromS < q.toS, { message: 'fromS must be earlier than toS', path: ['toS'] });
export type TraceQuery = z.infer<typeof traceQuerySchema>;

/**
 * A capture's samples in a window, min/max-decimated to at most 2·columns: times in s, voltages
 * in V. `fromS`/`toS` are the window actually served (the request clipped to the capture);
 * `windowPoints` is how many raw samples fall in it, so a client knows whether it sees them all.
 */
export interface Trace {
  timesS: number[];
  volts: number[];
  fromS: number;
  toS: number;
  totalPoints: number;
  windowPoints: number;
  /** Extent of the whole capture, s. */
  startS: number;
  endS: number;
  /** The channel drawn, and how many the capture has. */
  channel?: number;
  channelCount?: number;
}
