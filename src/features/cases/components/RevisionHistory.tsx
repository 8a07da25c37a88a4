import { diffLines } from 'diff';
import { useMemo, useState } from 'react';
import { revisionText } from '../../../../shared/cases/revision-text';
import type { Revision } from '../../../../shared/schemas/case';
import { Alert } from '../../../components/ui/Alert';
import { SelectField } from '../../../components/ui/Field';
import { Loading } from '../../../components/ui/Panel';
import { useRevisions } from '../api/list-revisions';

const when = (iso: string) => new Date(iso).toLocaleString([], { dateStyle: 'medium', timeStyle: 'short' });

const CONTEXT_LINES = 2;

interface DiffLine {
  kind: 'same' | 'added' | 'removed' | 'gap';
  text: string;
}

/** Diff parts as lines, with long unchanged runs folded to a few lines of context around each change. */
function diffRows(from: Revision, to: Revision, folded: boolean): DiffLine[] {
  const rows: DiffLine[] = [];
  const parts = diffLines(revisionText(from.snapshot), revisionText(to.snapshot));
  parts.forEach((p, i) => {
    const lines = p.value.replace(/\n$/, '').split('\n');
    const kind = p.added ? 'added' : p.removed ? 'removed' : 'same';
    if (kind !== 'same' || !folded) return lines.forEach((text) => rows.push({ kind, text }));
    const head = i === 0 ? 0 : CONTEXT_LINES;
    const tail = i === parts.length - 1 ? 0 : CONTEXT_LINES;
    if (lines.length <= head + tail + 1) return lines.forEach((text) => rows.push({ kind, text }));
    lines.slice(0, head).forEach((text) => rows.push({ kind, text }));
    rows.push({ kind: 'gap', text: `${lines.length - head - tail} unchanged lines` });
    lines.slice(lines.length - tail).forEach((text) => rows.push({ kind, text }));
  });
  return rows;
}

const ROW_STYLE: Record<DiffLine['kind'], string> = {
  added: 'bg-agree-soft',
  removed: 'bg-caution-soft line-through decoration-caution/60',
  same: 'text-muted',
  gap: 'my-1 border-y border-dashed border-rule text-center text-muted italic',
};
const MARK: Record<DiffLine['kind'], string> = { added: '+', removed: '−', same: ' ', gap: '' };
const SPOKEN: Record<DiffLine['kind'], string> = { added: 'added: ', removed: 'removed: ', same: '', gap: '' };

function Diff({ from, to }: { from: Revision; to: Revision }) {
  const [folded, setFolded] = useState(true);
  const rows = useMemo(() => diffRows(from, to, folded), [from, to, folded]);
  if (!rows.some((r) => r.kind === 'added' || r.kind === 'removed')) return <p className="text-sm text-muted">No differences in the write-up between these two.</p>;
  return (
    <div className="flex flex-col gap-1">
      <pre className="max-h-[28rem] overflow-auto rounded-md border border-rule bg-paper p-2 font-mono text-xs leading-relaxed whitespace-pre-wrap" aria-label={`Changes from revision ${from.number} to ${to.number}`}>
        {rows.map((r, i) => (
          <div key={i} className={ROW_STYLE[r.kind]}>
            {r.kind !== 'gap' && (
              <span aria-hidden className="mr-2 inline-block w-3 select-none">
                {MARK[r.kind]}
              </span>
            )}
            <span className="sr-only">{SPOKEN[r.kind]}</span>
            {r.text || ' '}
          </div>
        ))}
      </pre>
      <button type="button" className="self-start text-xs underline underline-offset-2" aria-pressed={!folded} onClick={() => setFolded((f) => !f)}>
        {folded ? 'Show every line' : 'Fold unchanged lines'}
      </button>
    </div>
  );
}

/** Every save after the first submission, with a line diff between any two of them. */
export function RevisionHistory({ caseId }: { caseId: number }) {
  const q = useRevisions(caseId);
  const [pick, setPick] = useState<{ from?: number; to?: number }>({});
  if (q.isPending) return <Loading what="Loading the history" />;
  if (q.isError) return <Alert tone="caution">{q.error.message}</Alert>;
  const revisions = q.data.revisions;
  if (revisions.length === 0) return <p className="text-sm text-muted">Revisions are kept from the first submission on; none yet.</p>;
  const byNumber = (n?: number) => revisions.find((r) => r.number === n);
  const to = byNumber(pick.to) ?? revisions[0];
  const from = byNumber(pick.from) ?? revisions[1] ?? revisions[0];
  const options = revisions.map((r) => ({ value: String(r.number), label: `#${r.number} · ${r.authorName} · ${when(r.createdAt)}` }));
  return (
    <div className="flex flex-col gap-3">
      <ol className="flex flex-col gap-1 text-sm">
        {revisions.map((r) => (
          <li key={r.id} className="flex flex-wrap gap-x-2">
            <span className="font-mono">#{r.number}</span>
            <span>{r.authorName}</span>
            <span className="text-muted">{when(r.createdAt)}</span>
          </li>
        ))}
      </ol>
      {revisions.length > 1 ? (
        <>
          <div className="grid gap-3 sm:grid-cols-2">
            <SelectField label="Compare revision" options={options} value={String(from.number)} onChange={(e) => setPick((p) => ({ ...p, from: Number(e.target.value) }))} />
            <SelectField label="with revision" options={options} value={String(to.number)} onChange={(e) => setPick((p) => ({ ...p, to: Number(e.target.value) }))} />
          </div>
          <Diff from={from.number <= to.number ? from : to} to={from.number <= to.number ? to : from} />
        </>
      ) : (
        <p className="text-sm text-muted">One revision so far: the write-up as it was submitted. Later saves show up here with their changes.</p>
      )}
    </div>
  );
}
