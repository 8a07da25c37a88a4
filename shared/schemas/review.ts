import { z } from 'zod';
import { stripControlCharsMultiline } from './clean-text';

export const REVIEW_ACTIONS = ['verify', 'send_back', 'retire', 'duplicate'] as const;
export type ReviewAction = (typeof REVIEW_ACTIONS)[number];

/** Body of `POST /api/cases/:id/review`; notes are required where the author must read why. */
export const reviewInputSchema = z
  .object({
    action: z.enum(REVIEW_ACTIONS, { error: `action must be one of ${REVIEW_ACTIONS.join(', ')}` }),
    note: z.string().overwrite(stripControlCharsMultiline).trim().max(5000, 'The note has at most 5000 characters').optional(),
    duplicateOf: z.coerce.number().int().positive('duplicateOf must be a case id').optional(),
  })
  .superRefine((v, ctx) => {
    if ((v.action === 'send_back' || v.action === 'retire') && !v.note) {
      ctx.addIssue({ code: 'custom', path: ['note'], message: v.action === 'send_back' ? 'Say what the author should change' : 'Give the reason for retiring the case' });
    }
    if (v.action === 'duplicate' && !v.duplicateOf) ctx.addIssue({ code: 'custom', path: ['duplicateOf'], message: 'Name the case this one duplicates' });
  });
export type ReviewInput = z.infer<typeof reviewInputSchema>;

export const NOTIFICATION_KINDS = ['submitted', 'sent_back', 'verified', 'retired', 'comment', 'mention', 'lessons'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];
export const NOTIFICATION_MODES = ['instant', 'digest', 'off'] as const;

export const NOTIFICATION_LABELS: Record<NotificationKind, string> = {
  submitted: 'A case is submitted for review (moderators)',
  sent_back: 'My case is sent back with notes',
  verified: 'A case I watch is verified',
  retired: 'A case I watch is retired or marked duplicate',
  comment: 'New comment on a case I watch',
  mention: 'Someone @mentions me',
  lessons: 'Newly verified lessons (daily digest)',
};

export const notificationPrefsSchema = z.partialRecord(
  z.enum(NOTIFICATION_KINDS),
  z.enum(NOTIFICATION_MODES, { error: 'Each kind is instant, digest or off' }),
);
export type NotificationPrefs = Partial<Record<NotificationKind, (typeof NOTIFICATION_MODES)[number]>>;

export interface AuditEntry {
  id: number;
  action: string;
  actorName: string | null;
  note: string | null;
  before: Record<string, unknown> | null;
  after: Record<string, unknown> | null;
  createdAt: string;
}
