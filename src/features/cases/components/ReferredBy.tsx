import { Link } from 'react-router-dom';
import type { CaseReference } from '../../../../shared/cases/case-references';

/** The cases whose write-up or comments link here (the server left out those the reader may not open). */
export function ReferredBy({ cases }: { cases: CaseReference[] }) {
  return (
    <ul className="flex flex-col gap-1 text-sm" aria-label="Cases that link here">
      {cases.map((r) => (
        <li key={r.id}>
          <Link to={`/cases/${r.id}`} className="underline underline-offset-2">
            <span className="font-mono">#{r.id}</span> {r.title}
          </Link>
        </li>
      ))}
    </ul>
  );
}
