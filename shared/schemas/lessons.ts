import { z } from 'zod';
import type { CaseReference } from '../cases/case-references';

/** A verified case's lesson as the Lessons page and the bench checklist show it. */
export interface Lesson {
  caseId: number;
  title: string;
  cause: string | null;
  lessonSummary: string;
  lessonDetail: string | null;
  verifiedAt: string | null;
  pinned: boolean;
  pinPosition: number | null;
  /** Cases the lesson names as `#123` that the reader may open. */
  references: CaseReference[];
}

export interface LessonGroup {
  cause: string;
  label: string;
  /** The group's latest lessons (at most 50 of `total`). */
  lessons: Lesson[];
  /** How many verified lessons the group has; with `totalCapped`, at least this many (the count stops at 1,000). */
  total: number;
  totalCapped?: true;
}

/** Verified lessons grouped by cause, and the pinned bench checklist in its order. */
export interface LessonBook {
  groups: LessonGroup[];
  checklist: Lesson[];
}

/** A moderator's new order for the bench checklist: every pinned lesson's case id, once, top first. */
export const checklistOrderSchema = z.object({
  caseIds: z
    .array(z.number({ error: 'each case id must be a number' }).int('case ids are whole numbers').positive('case ids are positive'), {
      error: 'caseIds must be a list of case ids',
    })
    .max(500, 'a checklist holds at most 500 lessons')
    .refine((ids) => new Set(ids).size === ids.length, 'each lesson may appear only once'),
});
export type ChecklistOrder = z.infer<typeof checklistOrderSchema>;
