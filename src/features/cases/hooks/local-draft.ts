import type { CaseFormValues } from '../form/case-form-schema';

/** Unsaved editor values kept in this browser, so a reload or a lost connection loses nothing. */
export interface LocalDraft {
  values: CaseFormValues;
  /** When these values were typed (ISO). */
  editedAt: string;
  /** The server version they were typed on top of. */
  baseUpdatedAt: string | null;
  /** The form as last saved when these edits began, so a restore can put back only what was changed. */
  baseValues?: CaseFormValues;
}

type Tree = { [k: string]: unknown };
const isTree = (v: unknown): v is Tree => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * A three-way merge of form values: every field where `mine` differs from `base` wins over
 * `current`; the rest of `current` (what others saved since) stays. Arrays count as one field.
 */
export function mergeEdits<T>(base: T, mine: T, current: T): T {
  if (isTree(base) && isTree(mine) && isTree(current)) {
    const out: Tree = { ...current };
    for (const key of Object.keys(mine)) out[key] = mergeEdits(base[key], mine[key], current[key]);
    return out as T;
  }
  return JSON.stringify(mine) !== JSON.stringify(base) ? mine : current;
}

const keyFor = (userId: number, caseId: number | null) => `ft.case-draft:${userId}:${caseId ?? 'new'}`;

export function readLocalDraft(userId: number, caseId: number | null): LocalDraft | null {
  try {
    const raw = localStorage.getItem(keyFor(userId, caseId));
    if (!raw) return null;
    const d = JSON.parse(raw) as LocalDraft;
    return d && typeof d.editedAt === 'string' && d.values ? d : null;
  } catch {
    return null;
  }
}

export function writeLocalDraft(userId: number, caseId: number | null, draft: LocalDraft) {
  try {
    localStorage.setItem(keyFor(userId, caseId), JSON.stringify(draft));
  } catch {
    // storage full or disabled: the server copy is still the safety net
  }
}

export function clearLocalDraft(userId: number, caseId: number | null) {
  try {
    localStorage.removeItem(keyFor(userId, caseId));
  } catch {
    /* nothing to clear */
  }
}
