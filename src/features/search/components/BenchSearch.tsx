import { useId, type ReactNode } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import { useKeyboardList } from '../../../components/keyboard/use-keyboard-list';
import { CopyLinkButton } from '../../../components/ui/CopyLinkButton';
import { Loading } from '../../../components/ui/Panel';
import { useSearchCases } from '../api/search-cases';
import { useSearchAddress } from '../hooks/use-search-address';
import { SearchFacets } from './SearchFacets';
import { SearchResultItem } from './SearchResultItem';

const NO_RESULTS: never[] = [];

/** The symptom chips of the Bench; each reads as an observation the engine can diagnose. */
export const SYMPTOM_CHIPS = [
  'Amplitude off by a round factor',
  'Ringing after edges',
  'Rounded edges',
  'Spikes on square-wave corners',
  'Amplitude falls with frequency',
  'DC level sags',
  'Looks slower than it is',
  'Tops flattened',
  'Tops droop',
  'Hum on every channel',
  'Reads double',
] as const;

/**
 * Symptom-first search for the Bench: searches as the user types (debounced), says how the
 * query was read ("read as: amplitude ×0.1 → attenuation mismatch"), lists results with the
 * matched words marked and links to each case, and offers facet filters and symptom chips.
 */
export function BenchSearch({
  pageSize = 10,
  actions,
}: {
  pageSize?: number;
  /** Shown under the box for the search as it stands (the Bench puts "Save this search" here). */
  actions?: (current: { q: string; cause?: string; tag?: string }) => ReactNode;
}) {
  const id = useId();
  const navigate = useNavigate();
  // `/` pressed on a page without a search box comes here to type
  const focusRequested = Boolean((useLocation().state as { focusSearch?: boolean } | null)?.focusSearch);
  const { text, setText, q, filters, setFilters, startSearch } = useSearchAddress();
  const search = useSearchCases({ q, ...filters, pageSize });
  const data = search.data;
  const active = q.trim() !== '' || Boolean(filters.cause || filters.tag || filters.status);
  const keyboard = useKeyboardList(data?.results ?? NO_RESULTS, (r) => navigate(`/cases/${r.id}`));

  return (
    <div className="flex flex-col gap-4">
      <form role="search" aria-label="Symptom search" onSubmit={(e) => e.preventDefault()}>
        <label htmlFor={`${id}-q`} className="text-sm font-semibold">
          Symptom search
        </label>
        <input
          id={`${id}-q`}
          type="search"
          value={text}
          onChange={(e) => setText(e.target.value)}
          placeholder="e.g. reads a tenth of the expected 3.3 V, ringing at 120 MHz"
          autoComplete="off"
          autoFocus={focusRequested}
          data-kb-search
          className="mt-1 w-full rounded-md border border-rule bg-paper px-3 py-3 text-lg focus:border-ink focus:outline-none focus:ring-2 focus:ring-agree/60"
          aria-describedby={`${id}-reading`}
        />
        <p id={`${id}-reading`} className="mt-2 min-h-5 font-mono text-sm text-agree" aria-live="polite" data-testid="search-reading">
          {active && data?.reading ? data.reading.text : ''}
        </p>
        <ul className="mt-2 flex flex-wrap gap-2" aria-label="Common symptoms">
          {SYMPTOM_CHIPS.map((chip) => (
            <li key={chip}>
              <button
                type="button"
                onClick={() => startSearch(`${chip} `)}
                className="rounded-full border border-rule px-3 py-1 text-sm hover:border-ink"
              >
                {chip}
              </button>
            </li>
          ))}
        </ul>
      </form>

      {active && actions?.({ q, cause: filters.cause, tag: filters.tag })}

      {active && (
        <div className="grid gap-6 md:grid-cols-[1fr_14rem]">
          <section aria-label="Search results" aria-busy={search.isFetching}>
            {search.isPending && <Loading what="Searching" />}
            {search.isError && <p className="text-sm text-caution">{search.error.message}</p>}
            {data && (
              <>
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <p className="text-sm text-muted" data-testid="search-total">
                    {data.total === 0 ? 'No case matches yet. Try fewer words, or a symptom chip.' : `${data.total} case${data.total === 1 ? '' : 's'}`}
                  </p>
                  <CopyLinkButton label="Copy link to this search" />
                </div>
                <ul className="flex flex-col divide-y divide-rule/70" {...keyboard.listProps}>
                  {data.results.map((r, i) => (
                    <SearchResultItem key={r.id} result={r} rowProps={keyboard.rowProps(i)} />
                  ))}
                </ul>
              </>
            )}
          </section>
          {data && <SearchFacets facets={data.facets} filters={filters} onChange={setFilters} />}
        </div>
      )}
    </div>
  );
}
