import { causeLabel } from '../../../components/ui/CauseChip';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/Alert';
import { Loading, Panel } from '../../../components/ui/Panel';
import { useDeleteSavedSearch } from '../api/delete-saved-search';
import { useSavedSearches } from '../api/list-saved-searches';

/** The profile's list of saved searches, each removable. */
export function SavedSearchList() {
  const list = useSavedSearches();
  const remove = useDeleteSavedSearch();
  return (
    <Panel title="Saved searches" className="mt-6">
      {list.isPending && <Loading what="Loading your saved searches" />}
      {list.isError && <Alert tone="caution">{list.error.message}</Alert>}
      {remove.isError && <Alert tone="caution">{remove.error.message}</Alert>}
      {list.data &&
        (list.data.savedSearches.length === 0 ? (
          <p className="text-sm text-muted">
            No saved searches. Search on the <Link to="/" className="underline underline-offset-2">Bench</Link> and choose “Save this search” to be told when a matching case is verified.
          </p>
        ) : (
          <ul className="flex flex-col divide-y divide-rule/70" aria-label="Saved searches">
            {list.data.savedSearches.map((s) => (
              <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <div className="min-w-0">
                  <p className="font-semibold break-words">{s.name}</p>
                  <p className="text-xs text-muted">
                    <span className="font-mono">{s.q || '(no words)'}</span>
                    {s.cause && <> · cause: {causeLabel(s.cause)}</>}
                    {s.tag && <> · tag {s.tag}</>} · {s.delivery === 'mail' ? 'mail at once' : 'daily digest'}
                  </p>
                </div>
                <button
                  type="button"
                  className="rounded-md border border-rule px-3 py-1 text-sm hover:border-ink"
                  aria-label={`Remove the saved search ${s.name}`}
                  disabled={remove.isPending}
                  onClick={() => remove.mutate(s.id)}
                >
                  Remove
                </button>
              </li>
            ))}
          </ul>
        ))}
    </Panel>
  );
}
