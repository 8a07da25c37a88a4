import { z } from 'zod';

/**
 * `PATCH /api/attachments/:id/capture`: which channel of a stored capture is analysed, and
 * whether it was taken before or after the fix (null clears the mark). One capture per case
 * holds each mark; setting it moves it from the capture that had it.
 */
export const captureAttachmentPatchSchema = z
  .object({
    channel: z.number({ error: 'channel must be a channel number' }).int('channel must be a whole number').min(1, 'channels are numbered from 1').max(64, 'channel is at most 64').optional(),
    role: z.enum(['before', 'after'], { error: "role must be 'before', 'after' or null" }).nullable().optional(),
  })
  .strict();
export type CaptureAttachmentPatch = z.infer<typeof captureAttachmentPatchSchema>;
