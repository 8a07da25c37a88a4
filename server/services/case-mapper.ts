import { canCommentOnCase, canEditCase, canSubmitCase } from '../../shared/auth/case-policy';
import type { Actor } from '../../shared/auth/roles';
import type { Attachment, Case, CaseSetup, CaseSummary, StatedCause } from '../../shared/schemas/case';
import type { DiagnosisResult } from '../../shared/schemas/diagnosis';
import type { AttachmentRow } from '../db/repositories/attachments';
import type { CaseListRow, CaseRowWithAuthor } from '../db/repositories/cases';

const parseJson = <T>(text: string | null, fallback: T): T => {
  if (!text) return fallback;
  try {
    return JSON.parse(text) as T;
  } catch {
    return fallback;
  }
};

export function toAttachment(row: AttachmentRow): Attachment {
  return {
    id: row.id,
    kind: row.kind,
    url: `/api/attachments/${row.id}/file`,
    thumbnailUrl: row.thumbnail_name ? `/api/attachments/${row.id}/thumbnail` : null,
    originalName: row.original_name,
    contentType: row.content_type,
    sizeBytes: row.size_bytes,
    width: row.width,
    height: row.height,
    createdAt: row.created_at,
    analysis: parseJson(row.analysis, null),
    captureRole: row.capture_role ?? null,
  };
}

export function toCaseSummary(row: CaseListRow, tags: string[]): CaseSummary {
  return {
    id: row.id,
    title: row.title,
    summary: row.summary,
    status: row.status,
    cause: row.cause,
    tags,
    authorName: row.author_name,
    updatedAt: row.updated_at,
    createdAt: row.created_at,
  };
}

export function toCase(row: CaseRowWithAuthor, tags: string[], attachments: AttachmentRow[], actor: Actor): Case {
  const facts = { authorId: row.author_id, status: row.status };
  return {
    ...toCaseSummary(row, tags),
    narrative: row.narrative,
    setup: parseJson<CaseSetup>(row.setup, {}),
    statedCause: (row.stated_cause as StatedCause | null) ?? null,
    statedCauseOther: row.stated_cause_other,
    fix: row.fix,
    lessonSummary: row.lesson_summary,
    lessonDetail: row.lesson_detail,
    safetyNote: row.safety_note ?? null,
    diagnosis: parseJson<DiagnosisResult | null>(row.diagnosis, null),
    disagreesWithEngine: row.disagrees === 1,
    attachments: attachments.map(toAttachment),
    authorId: row.author_id,
    reviewNote: row.review_note,
    submittedAt: row.submitted_at,
    permissions: { edit: canEditCase(actor, facts), submit: canSubmitCase(actor, facts), comment: canCommentOnCase(actor, facts) },
    // filled by loadCase, which asks the visibility policy for each linked case
    references: [],
    referredBy: [],
  };
}
