import { createColumnHelper, rowPaginationFeature, rowSortingFeature, tableFeatures, useTable, type PaginationState, type SortingState, type Updater } from '@tanstack/react-table';
import { Link, useNavigate } from 'react-router-dom';
import { useKeyboardList } from '../../../components/keyboard/use-keyboard-list';
import type { CaseSummary } from '../../../../shared/schemas/case';
import { CauseChip } from '../../../components/ui/CauseChip';
import { StatusBadge } from './StatusBadge';

const features = tableFeatures({ rowSortingFeature, rowPaginationFeature });
const helper = createColumnHelper<typeof features, CaseSummary>();

const day = (iso: string) => new Date(iso).toLocaleDateString([], { year: 'numeric', month: 'short', day: 'numeric' });

// Column ids are the server's sort keys (CASE_SORTS), so sorting state maps straight to `sort=`.
const columns = helper.columns([
  helper.accessor('title', {
    header: 'Title',
    cell: (info) => (
      <span className="flex flex-col">
        <Link to={`/cases/${info.row.original.id}`} className="font-serif font-bold underline-offset-2 hover:underline">
          {info.getValue()}
        </Link>
        <span className="text-xs text-muted">{info.row.original.summary}</span>
      </span>
    ),
  }),
  helper.accessor('status', {
    header: 'Status',
    cell: (info) => (
      <span className="whitespace-nowrap">
        <StatusBadge status={info.getValue()} />
      </span>
    ),
  }),
  helper.accessor('cause', { header: 'Cause', cell: (info) => <CauseChip cause={info.getValue()} /> }),
  helper.accessor('tags', {
    header: 'Tags',
    enableSorting: false,
    cell: (info) => (
      <span className="flex flex-wrap gap-1">
        {info.getValue().map((t) => (
          <span key={t} className="rounded-full border border-rule px-1.5 font-mono text-[11px]">
            {t}
          </span>
        ))}
      </span>
    ),
  }),
  helper.accessor('authorName', { id: 'author', header: 'Author' }),
  helper.accessor('updatedAt', { header: 'Updated', sortDescFirst: true, cell: (info) => <span className="font-mono text-xs whitespace-nowrap">{day(info.getValue())}</span> }),
]);

const toSorting = (sort: string): SortingState => [{ id: sort.replace(/^-/, ''), desc: sort.startsWith('-') }];
const fromSorting = (s: SortingState) => (s[0] ? `${s[0].desc ? '-' : ''}${s[0].id}` : '');
const apply = <T,>(u: Updater<T>, old: T): T => (typeof u === 'function' ? (u as (o: T) => T)(old) : u);

export interface CasesTableProps {
  rows: CaseSummary[];
  total: number;
  sort: string;
  page: number;
  pageSize: number;
  onSort: (sort: string) => void;
  onPage: (page: number, pageSize: number) => void;
}

/** Server-sorted, server-paged: the table only says which sort and page to ask for next. */
export function CasesTable({ rows, total, sort, page, pageSize, onSort, onPage }: CasesTableProps) {
  const sorting = toSorting(sort);
  const pagination: PaginationState = { pageIndex: page - 1, pageSize };
  const table = useTable({
    features,
    columns,
    data: rows,
    rowCount: total,
    state: { sorting, pagination },
    onSortingChange: (u) => onSort(fromSorting(apply(u, sorting))),
    onPaginationChange: (u) => {
      const next = apply(u, pagination);
      onPage(next.pageIndex + 1, next.pageSize);
    },
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    getRowId: (row) => String(row.id),
  });
  const navigate = useNavigate();
  const keyboard = useKeyboardList(rows, (c) => navigate(`/cases/${c.id}`));
  return (
    <div {...keyboard.listProps}>
      <table className="hidden w-full text-left text-sm md:table">
        <thead className="text-xs tracking-wide text-muted uppercase">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                return (
                  <th key={header.id} scope="col" className={`pb-2 pr-3 font-semibold ${header.column.id === 'title' ? 'pl-2.5' : ''}`} aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}>
                    {header.column.getCanSort() ? (
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 uppercase hover:text-ink">
                        <table.FlexRender header={header} />
                        <span aria-hidden className="font-mono">
                          {sorted === 'asc' ? '↑' : sorted === 'desc' ? '↓' : '↕'}
                        </span>
                      </button>
                    ) : (
                      <table.FlexRender header={header} />
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row, i) => (
            <tr key={row.id} className="border-t border-rule align-top" {...keyboard.rowProps(i)}>
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className={`py-2.5 pr-3 ${cell.column.id === 'title' ? 'max-w-[28rem] pl-2.5' : ''}`}>
                  <table.FlexRender cell={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {/* phones: the same rows as cards; the sort is chosen above the list */}
      <ul className="flex flex-col gap-2 md:hidden" aria-label="Cases">
        {table.getRowModel().rows.map(({ original: c }, i) => (
          <li key={c.id} className="rounded-md border border-rule bg-paper/50 p-3" {...keyboard.rowProps(i)}>
            <Link to={`/cases/${c.id}`} className="font-serif font-bold">
              {c.title}
            </Link>
            <p className="text-xs text-muted">{c.summary}</p>
            <div className="mt-2 flex flex-wrap items-center gap-2 text-xs">
              <StatusBadge status={c.status} />
              <CauseChip cause={c.cause} />
              <span className="text-muted">
                {c.authorName} · <span className="font-mono">{day(c.updatedAt)}</span>
              </span>
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}
