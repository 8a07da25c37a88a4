import { Link } from 'react-router-dom';
import { CauseChip } from '../../../components/ui/CauseChip';
import { Loading } from '../../../components/ui/Panel';
import { useSimilarCases } from '../api/get-similar-cases';

/** Cases like this one (same cause, nearby numbers, shared words), for the case page. */
export function SimilarCases({ caseId }: { caseId: number }) {
  const q = useSimilarCases(caseId);
  if (q.isPending) return <Loading what="Finding similar cases" />;
  if (q.isError) return <p className="text-sm text-caution">{q.error.message}</p>;
  if (q.data.similar.length === 0) return <p className="text-sm text-muted">No similar cases yet.</p>;
  return (
    <ul className="flex flex-col divide-y divide-rule/70" data-testid="similar-cases">
      {q.data.similar.map((c) => (
        <li key={c.id} className="flex flex-col gap-1 py-2">
          <Link to={`/cases/${c.id}`} className="font-serif font-bold hover:underline">
            {c.title}
          </Link>
          <p className="text-sm text-muted">{c.summary}</p>
          <span className="flex items-center gap-2 text-xs text-muted">
            <CauseChip cause={c.cause} />
            <span className="font-mono" title="Similarity: cause, numbers and words">
              {c.score.toFixed(2)}
            </span>
          </span>
        </li>
      ))}
    </ul>
  );
}
