import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { Loading } from '../../../components/ui/Panel';
import { useWatches } from '../api/get-watches';
import { useTagNames } from '../api/list-tag-names';
import { useSetCaseWatch } from '../api/watch-case';
import { useSetTagWatch } from '../api/watch-tag';

/** Watched tags (add and remove) and watched cases (remove); watching sends the mails chosen beside it. */
export function WatchList() {
  const watches = useWatches();
  const tags = useTagNames();
  const tagWatch = useSetTagWatch();
  const caseWatch = useSetCaseWatch();
  const [pick, setPick] = useState('');
  if (watches.isPending) return <Loading what="Loading what you watch" />;
  if (watches.isError) return <Alert tone="caution">{watches.error.message}</Alert>;
  const { cases, tags: watchedTags } = watches.data;
  const offer = (tags.data?.tags ?? []).filter((t) => !t.retired && !watchedTags.includes(t.tag));
  const error = tagWatch.error ?? caseWatch.error;
  return (
    <div className="flex flex-col gap-5">
      {error && <Alert tone="caution">{error.message}</Alert>}
      <section aria-labelledby="watched-tags">
        <h3 id="watched-tags" className="text-sm font-semibold">
          Tags
        </h3>
        <p className="text-xs text-muted">Watching a tag is watching every case that carries it: its comments, verification and retirement.</p>
        {watchedTags.length === 0 ? (
          <p className="mt-2 text-sm text-muted">You watch no tag.</p>
        ) : (
          <ul className="mt-2 flex flex-wrap gap-2" aria-label="Watched tags">
            {watchedTags.map((t) => (
              <li key={t} className="flex items-center gap-1 rounded-full border border-rule bg-paper py-0.5 pr-1 pl-3 font-mono text-sm">
                {t}
                <button
                  type="button"
                  className="rounded-full px-2 font-sans text-xs text-muted hover:text-ink"
                  aria-label={`Stop watching the tag ${t}`}
                  disabled={tagWatch.isPending}
                  onClick={() => tagWatch.mutate({ tag: t, watching: false })}
                >
                  Unwatch
                </button>
              </li>
            ))}
          </ul>
        )}
        <form
          className="mt-3 flex flex-wrap items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (pick) tagWatch.mutate({ tag: pick, watching: true }, { onSuccess: () => setPick('') });
          }}
        >
          <div className="flex min-w-0 flex-1 flex-col gap-1">
            <label htmlFor="watch-tag" className="text-sm font-semibold">
              Watch a tag
            </label>
            <select id="watch-tag" value={pick} onChange={(e) => setPick(e.target.value)} className="w-full rounded-md border border-rule bg-sheet px-3 py-2 font-mono text-sm" disabled={offer.length === 0}>
              <option value="">{offer.length ? 'Choose a tag…' : 'No other tag to watch'}</option>
              {offer.map((t) => (
                <option key={t.tag} value={t.tag}>
                  {t.tag} ({t.count})
                </option>
              ))}
            </select>
          </div>
          <Button type="submit" variant="secondary" disabled={!pick} busy={tagWatch.isPending && tagWatch.variables?.watching}>
            Watch
          </Button>
        </form>
      </section>
      <section aria-labelledby="watched-cases">
        <h3 id="watched-cases" className="text-sm font-semibold">
          Cases
        </h3>
        <p className="text-xs text-muted">You watch the cases you write; watch others from their case page.</p>
        {cases.length === 0 ? (
          <p className="mt-2 text-sm text-muted">You watch no case.</p>
        ) : (
          <ul className="mt-2 flex flex-wrap gap-2" aria-label="Watched cases">
            {cases.map((id) => (
              <li key={id} className="flex items-center gap-1 rounded-full border border-rule bg-paper py-0.5 pr-1 pl-3 text-sm">
                <Link to={`/cases/${id}`} className="font-mono underline underline-offset-2">
                  #{id}
                </Link>
                <button
                  type="button"
                  className="rounded-full px-2 text-xs text-muted hover:text-ink"
                  aria-label={`Stop watching case #${id}`}
                  disabled={caseWatch.isPending}
                  onClick={() => caseWatch.mutate({ caseId: id, watching: false })}
                >
                  Unwatch
                </button>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
