import { Link } from 'react-router-dom';
import { Loading } from '../../../components/ui/Panel';
import { useCases, type CaseListFilters } from '../api/list-cases';
import { CauseChip } from '../../../components/ui/CauseChip';

const day = (iso: string) => new Date(iso).toLocaleDateString([], { month: 'short', day: 'numeric' });

/** A short list of cases for a dashboard panel, with a link to the full table. */
export function CaseMiniList({ filters, empty, moreLabel, editLinks }: { filters: CaseListFilters; empty: string; moreLabel: string; editLinks?: boolean }) {
  const q = useCases({ pageSize: '5', ...filters });
  if (q.isPending) return <Loading what="Loading" />;
  if (q.isError) return <p className="text-sm text-caution">{q.error.message}</p>;
  const { cases, total, totalCapped } = q.data;
  const { pageSize: _size, page: _page, ...tableFilters } = filters;
  const more = `/cases?${new URLSearchParams(tableFilters as Record<string, string>).toString()}`;
  if (cases.length === 0) return <p className="text-sm text-muted">{empty}</p>;
  return (
    <div>
      <ul className="flex flex-col divide-y divide-rule/70">
        {cases.map((c) => (
          <li key={c.id} className="flex flex-col gap-1 py-2">
            <Link to={editLinks ? `/cases/${c.id}/edit` : `/cases/${c.id}`} className="font-serif font-bold hover:underline">
              {c.title}
            </Link>
            <span className="flex flex-wrap items-center gap-2 text-xs text-muted">
              <CauseChip cause={c.cause} />
              <span className="font-mono">{day(c.updatedAt)}</span>
            </span>
          </li>
        ))}
      </ul>
      {total > cases.length && (
        <Link to={more} className="mt-2 inline-block text-sm underline underline-offset-2">
          {moreLabel} ({total}{totalCapped ? '+' : ''})
        </Link>
      )}
    </div>
  );
}
