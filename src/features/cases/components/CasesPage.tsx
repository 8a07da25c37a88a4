import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/Alert';
import { CopyLinkButton } from '../../../components/ui/CopyLinkButton';
import { SelectField } from '../../../components/ui/Field';
import { Loading, PageHeader, Panel } from '../../../components/ui/Panel';
import { useCases } from '../api/list-cases';
import { FILTER_KEYS, PAGE_SIZES, useCaseListParams } from '../hooks/use-case-list-params';
import { CaseFilters } from './CaseFilters';
import { CasesTable } from './CasesTable';

const SORT_OPTIONS = [
  { value: '-updatedAt', label: 'Recently updated' },
  { value: 'updatedAt', label: 'Least recently updated' },
  { value: '-createdAt', label: 'Newest' },
  { value: 'title', label: 'Title A–Z' },
  { value: 'status', label: 'Status' },
  { value: 'cause', label: 'Cause' },
  { value: 'author', label: 'Author' },
];

const newCaseLink = 'inline-flex items-center rounded-md border border-ink bg-ink px-4 py-2 text-sm font-semibold text-paper hover:opacity-90';

export function CasesPage() {
  const { filters, update, page, pageSize, sort, active } = useCaseListParams();
  const activeCount = FILTER_KEYS.filter((k) => filters[k]).length;
  // phones: the filters fold away so the list is on the first screen
  const [showFilters, setShowFilters] = useState(false);
  const query = useCases({ ...filters, page: String(page), pageSize: String(pageSize), sort });
  const data = query.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / pageSize)) : 1;
  const first = data && data.total > 0 ? (page - 1) * pageSize + 1 : 0;
  const last = data ? Math.min(data.total, page * pageSize) : 0;
  const goTo = (p: number, size = pageSize) => update({ page: p > 1 ? String(p) : '', pageSize: size === 20 ? '' : String(size) });
  return (
    <>
      <PageHeader
        title="Cases"
        lead="Every measurement that lied that you may see: verified cases, and your own at any stage."
        actions={
          <Link to="/cases/new" className={newCaseLink}>
            New case
          </Link>
        }
      />
      <div className="flex flex-col gap-4">
        <Panel>
          <button
            type="button"
            className="w-full rounded-md border border-rule px-3 py-2 text-left text-sm font-semibold md:hidden"
            aria-expanded={showFilters}
            aria-controls="case-filters"
            onClick={() => setShowFilters((s) => !s)}
          >
            {showFilters ? 'Hide filters' : `Filters${activeCount ? ` (${activeCount} on)` : ''}`}
          </button>
          <div id="case-filters" className={`${showFilters ? 'mt-3' : 'hidden'} md:mt-0 md:block`}>
            <CaseFilters filters={filters} onChange={update} active={active} />
          </div>
        </Panel>
        <Panel>
          <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
            <p role="status" className="text-sm text-muted">
              {data ? (data.total === 0 ? 'No cases' : `${first}–${last} of ${data.total.toLocaleString('en')}${data.totalCapped ? '+' : ''} case${data.total === 1 ? '' : 's'}`) : ' '}
              {query.isFetching && data ? ' · updating…' : ''}
            </p>
            <CopyLinkButton label="Copy link to this view" />
            <div className="w-full md:hidden">
              <SelectField label="Sort by" options={SORT_OPTIONS} value={SORT_OPTIONS.some((o) => o.value === sort) ? sort : '-updatedAt'} onChange={(e) => update({ sort: e.target.value })} />
            </div>
          </div>
          {query.isPending && <Loading what="Loading cases" />}
          {query.isError && (
            <Alert tone="caution" title="The cases could not be loaded">
              {query.error.message}
            </Alert>
          )}
          {data && data.cases.length === 0 && (
            <div className="py-8 text-center">
              <p className="font-serif text-lg">{active ? 'No case matches these filters.' : 'No cases yet.'}</p>
              <p className="mt-1 text-sm text-muted">
                {active ? 'Loosen a filter, or ' : 'Be the first: '}
                <Link to="/cases/new" className="underline underline-offset-2">
                  file the measurement that fooled you
                </Link>
                .
              </p>
            </div>
          )}
          {data && data.cases.length > 0 && (
            <CasesTable
              rows={data.cases}
              total={data.total}
              sort={sort}
              page={page}
              pageSize={pageSize}
              onSort={(s) => update({ sort: s === '-updatedAt' ? '' : s })}
              onPage={goTo}
            />
          )}
          {data && data.total > 0 && (
            <nav aria-label="Pages" className="mt-4 flex flex-wrap items-center justify-between gap-3 border-t border-rule pt-3 text-sm">
              <div className="flex items-center gap-2">
                <button type="button" className="rounded-md border border-rule px-3 py-1.5 disabled:opacity-50" disabled={page <= 1} onClick={() => goTo(page - 1)}>
                  ← Previous
                </button>
                <span className="font-mono text-xs">
                  Page {page} of {pages}
                </span>
                <button type="button" className="rounded-md border border-rule px-3 py-1.5 disabled:opacity-50" disabled={page >= pages} onClick={() => goTo(page + 1)}>
                  Next →
                </button>
              </div>
              <label className="flex items-center gap-2">
                Rows per page
                <select value={pageSize} onChange={(e) => goTo(1, Number(e.target.value))} className="rounded-md border border-rule bg-sheet px-2 py-1">
                  {PAGE_SIZES.map((n) => (
                    <option key={n}>{n}</option>
                  ))}
                </select>
              </label>
            </nav>
          )}
        </Panel>
      </div>
    </>
  );
}
