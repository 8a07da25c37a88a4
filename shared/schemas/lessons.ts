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
}

export interface LessonGroup {
  cause: string;
  label: string;
  lessons: Lesson[];
}

/** Verified lessons grouped by cause, and the pinned bench checklist in its order. */
export interface LessonBook {
  groups: LessonGroup[];
  checklist: Lesson[];
}
