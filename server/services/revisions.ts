import { diffLines } from 'diff';
import { revisionText } from '../../shared/cases/revision-text';
import type { Actor } from '../../shared/auth/roles';
import type { Revision } from '../../shared/schemas/case';
import { listRevisions } from '../db/repositories/revisions';
import type { AppDeps } from '../deps';
import { notFound } from '../errors';
import { visibleCaseRow } from './cases';

export async function revisionsOf({ db }: AppDeps, actor: Actor, caseId: number): Promise<Revision[]> {
  await visibleCaseRow(db, actor, caseId);
  return (await listRevisions(db, caseId)).map((r) => ({
    id: r.id,
    number: r.number,
    authorName: r.author_name ?? 'former member',
    createdAt: r.created_at,
    snapshot: JSON.parse(r.snapshot),
  }));
}

export interface DiffPart {
  kind: 'same' | 'added' | 'removed';
  text: string;
}

/** Line diff between two revisions of a case, oldest first whatever order they are asked in. */
export async function diffRevisions(deps: AppDeps, actor: Actor, caseId: number, a: number, b: number): Promise<DiffPart[]> {
  const revisions = await revisionsOf(deps, actor, caseId);
  const [from, to] = [Math.min(a, b), Math.max(a, b)].map((n) => revisions.find((r) => r.number === n));
  if (!from || !to) throw notFound(`This case has no revision ${!from ? Math.min(a, b) : Math.max(a, b)}`);
  return diffLines(revisionText(from.snapshot), revisionText(to.snapshot)).map((p) => ({
    kind: p.added ? 'added' : p.removed ? 'removed' : 'same',
    text: p.value,
  }));
}
