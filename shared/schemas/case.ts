import { z } from 'zod';
import { caseReferenceSchema } from '../cases/case-references';
import {
  causeSchema,
  circuitInputSchema,
  diagnosisResultSchema,
  observedInputSchema,
  probeInputSchema,
  scopeInputSchema,
  signalInputSchema,
} from './diagnosis';
import { stripControlChars, stripControlCharsMultiline } from './clean-text';

export const CASE_STATUSES = ['draft', 'in_review', 'needs_changes', 'verified', 'retired'] as const;
export const caseStatusSchema = z.enum(CASE_STATUSES, { error: `Status must be one of ${CASE_STATUSES.join(', ')}` });
export type CaseStatus = z.infer<typeof caseStatusSchema>;

export const CASE_STATUS_LABELS: Record<CaseStatus, string> = {
  draft: 'Draft',
  in_review: 'In review',
  needs_changes: 'Needs changes',
  verified: 'Verified',
  retired: 'Retired',
};

/** The stated root cause: one of the engine's causes, or `other` with its own words. */
export const statedCauseSchema = z.union([causeSchema, z.literal('other')], {
  error: 'Stated cause must be one of the engine causes or "other"',
});
export type StatedCause = z.infer<typeof statedCauseSchema>;

/** Single-line text loses every control and bidi character; `multiline` keeps tabs and newlines. */
const text = (label: string, max: number, multiline = false) =>
  z
    .string({ error: `${label} must be text` })
    .overwrite(multiline ? stripControlCharsMultiline : stripControlChars)
    .trim()
    .max(max, `${label}: at most ${max} characters`);
const optionalText = (label: string, max: number, multiline = false) => text(label, max, multiline).nullish();

/** Tags are short lower-case slugs, e.g. `10x-at-1x`, `gate-drive`. */
export const tagSchema = z
  .string()
  .overwrite(stripControlChars)
  .trim()
  .toLowerCase()
  .min(1, 'A tag cannot be empty')
  .max(40, 'A tag has at most 40 characters')
  .regex(/^[a-z0-9µ][a-z0-9µ.+-]*$/, 'Tags use letters, digits, dots, plus and hyphens (no spaces)');

/** The recorded setup: the diagnosis input plus what an engineer writes down at the bench. */
export const caseSetupSchema = z.object({
  probe: probeInputSchema
    .extend({
      model: optionalText('Probe model', 120),
      /** The ratio printed on the probe (1, 10, 100); `attenuation` is the ratio actually in effect. */
      nominalAttenuation: probeInputSchema.shape.attenuation,
      switchable: z.boolean().nullish(),
    })
    .nullish(),
  scope: scopeInputSchema
    .extend({
      model: optionalText('Scope model', 120),
      bandwidthLimitOn: z.boolean().nullish(),
    })
    .nullish(),
  circuit: circuitInputSchema
    .extend({
      nodeDescription: optionalText('Node description', 500),
      mainsConnected: z.boolean().nullish(),
      highestVoltageV: z.number().min(0, 'Highest voltage cannot be negative').max(1e6, 'Highest voltage must be at most 1 MV').nullish(),
    })
    .nullish(),
  signal: signalInputSchema.nullish(),
  observed: observedInputSchema.extend({ description: optionalText('Observation', 2000, true) }).nullish(),
});
export type CaseSetup = z.infer<typeof caseSetupSchema>;

const caseFields = {
  title: text('Title', 160).min(3, 'Give the case a title of at least 3 characters'),
  summary: text('Symptom summary', 280).min(3, 'Say in one line what the trace did'),
  narrative: text('Narrative', 50_000, true).optional(),
  setup: caseSetupSchema.optional(),
  statedCause: statedCauseSchema.nullish(),
  statedCauseOther: optionalText('Other cause', 200),
  fix: optionalText('Fix', 5000, true),
  lessonSummary: optionalText('Lesson', 200),
  lessonDetail: optionalText('Lesson detail', 5000, true),
  /** How to probe this circuit safely; the review asks for it whenever the engine raises a risk. */
  safetyNote: optionalText('Safety note', 2000, true),
  tags: z.array(tagSchema).max(12, 'At most 12 tags').optional(),
};

export const caseCreateSchema = z.object(caseFields);
export type CaseCreateInput = z.infer<typeof caseCreateSchema>;

export const casePatchSchema = z
  .object(caseFields)
  .partial()
  .extend({
    /** The updatedAt the editor loaded; a stale one means someone else saved meanwhile (409). */
    baseUpdatedAt: z.string().optional(),
  });
export type CasePatchInput = z.infer<typeof casePatchSchema>;

export const ATTACHMENT_KINDS = ['screenshot', 'capture'] as const;
export type AttachmentKind = (typeof ATTACHMENT_KINDS)[number];

export const attachmentSchema = z.object({
  id: z.number(),
  kind: z.enum(ATTACHMENT_KINDS),
  url: z.string(),
  thumbnailUrl: z.string().nullable(),
  originalName: z.string(),
  contentType: z.string(),
  sizeBytes: z.number(),
  width: z.number().nullable(),
  height: z.number().nullable(),
  createdAt: z.string(),
  /** Capture analysis (the `POST /api/captures/analyze` shape) for captures, else null. */
  analysis: z.record(z.string(), z.unknown()).nullable(),
  /** A capture marked as taken before or after the fix, else null. */
  captureRole: z.enum(['before', 'after']).nullable().optional(),
});
export type Attachment = z.infer<typeof attachmentSchema>;

export const caseSchema = z.object({
  id: z.number(),
  title: z.string(),
  summary: z.string(),
  narrative: z.string(),
  status: caseStatusSchema,
  setup: caseSetupSchema,
  statedCause: statedCauseSchema.nullable(),
  statedCauseOther: z.string().nullable(),
  /** The stated root cause, else the engine's top cause. */
  cause: z.string().nullable(),
  fix: z.string().nullable(),
  lessonSummary: z.string().nullable(),
  lessonDetail: z.string().nullable(),
  safetyNote: z.string().nullable(),
  tags: z.array(z.string()),
  diagnosis: diagnosisResultSchema.nullable(),
  /** True when the stated cause differs from the engine's top cause (moderators look twice). */
  disagreesWithEngine: z.boolean(),
  attachments: z.array(attachmentSchema),
  authorId: z.number(),
  authorName: z.string(),
  reviewNote: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
  submittedAt: z.string().nullable(),
  permissions: z.object({ edit: z.boolean(), submit: z.boolean(), comment: z.boolean() }),
  /** Cases the narrative and lesson name as `#123` that the reader may open; others stay plain text. */
  references: z.array(caseReferenceSchema),
  /** Cases whose write-up or comments link here, as far as the reader may open them. */
  referredBy: z.array(caseReferenceSchema),
});
export type Case = z.infer<typeof caseSchema>;

export const caseSummarySchema = caseSchema.pick({
  id: true,
  title: true,
  summary: true,
  status: true,
  cause: true,
  tags: true,
  authorName: true,
  updatedAt: true,
  createdAt: true,
});
export type CaseSummary = z.infer<typeof caseSummarySchema>;

export const CASE_SORTS = ['updatedAt', '-updatedAt', 'createdAt', '-createdAt', 'title', '-title', 'status', '-status', 'cause', '-cause', 'author', '-author'] as const;

export const caseListQuerySchema = z.object({
  q: z.string().trim().max(200).optional(),
  cause: z.string().trim().max(40).optional(),
  tag: z.string().trim().max(40).optional(),
  status: caseStatusSchema.optional(),
  author: z.coerce.number().int().positive().optional(),
  from: z.iso.date({ error: 'from must be a date like 2026-01-31' }).optional(),
  to: z.iso.date({ error: 'to must be a date like 2026-01-31' }).optional(),
  page: z.coerce.number().int().min(1, 'page starts at 1').max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'pageSize is at most 100').default(20),
  sort: z.enum(CASE_SORTS, { error: `sort must be one of ${CASE_SORTS.join(', ')}` }).default('-updatedAt'),
});
export type CaseListQuery = z.infer<typeof caseListQuerySchema>;

export const commentInputSchema = z.object({
  body: text('Comment', 10_000, true).min(1, 'Write something first'),
});
export type CommentInput = z.infer<typeof commentInputSchema>;

export const commentSchema = z.object({
  id: z.number(),
  caseId: z.number(),
  authorId: z.number(),
  authorName: z.string(),
  body: z.string(),
  hidden: z.boolean(),
  createdAt: z.string(),
  updatedAt: z.string(),
  permissions: z.object({ edit: z.boolean(), delete: z.boolean(), hide: z.boolean() }),
  /** Cases the body names as `#123` that the reader may open. */
  references: z.array(caseReferenceSchema),
});
export type Comment = z.infer<typeof commentSchema>;

export const revisionSchema = z.object({
  id: z.number(),
  number: z.number(),
  authorName: z.string(),
  createdAt: z.string(),
  /** The case's write-up fields as they stood after this save. */
  snapshot: caseCreateSchema,
});
export type Revision = z.infer<typeof revisionSchema>;
