import { CASE_STATUS_LABELS, type CaseStatus } from '../../../../shared/schemas/case';
import type { SearchResponse } from '../../../../shared/schemas/search';
import { causeLabel } from '../../../components/ui/CauseChip';

export interface FacetFilters {
  cause?: string;
  tag?: string;
  status?: string;
}

/** Tags shown before the rest fold away: a facet is for picking, not for reading every tag. */
const TAGS_SHOWN = 12;

const GROUPS = [
  { key: 'cause', facet: 'cause', title: 'Cause', label: causeLabel },
  { key: 'tag', facet: 'tags', title: 'Tag', label: (v: string) => v },
  { key: 'status', facet: 'status', title: 'Status', label: (v: string) => CASE_STATUS_LABELS[v as CaseStatus] ?? v },
] as const;

/** Facet counts as toggle buttons: pressing one filters by it, pressing it again clears it. */
export function SearchFacets({ facets, filters, onChange }: { facets: SearchResponse['facets']; filters: FacetFilters; onChange: (f: FacetFilters) => void }) {
  return (
    <div className="flex flex-col gap-4" aria-label="Filter results">
      {GROUPS.map(({ key, facet, title, label }) => {
        const entries = Object.entries(facets[facet]).slice(0, key === 'tag' ? TAGS_SHOWN : undefined);
        // a chosen value stays on show (at 0) so it can be switched off again
        const chosen = filters[key];
        if (chosen && !(chosen in facets[facet])) entries.unshift([chosen, 0]);
        if (entries.length === 0) return null;
        return (
          <fieldset key={key}>
            <legend className="mb-1 text-xs font-semibold uppercase tracking-wide text-muted">{title}</legend>
            <ul className="flex flex-wrap gap-1.5">
              {entries.map(([value, count]) => {
                const on = filters[key] === value;
                return (
                  <li key={value}>
                    <button
                      type="button"
                      aria-pressed={on}
                      onClick={() => onChange({ ...filters, [key]: on ? undefined : value })}
                      className={`rounded-full border px-2.5 py-0.5 text-xs ${on ? 'border-ink bg-ink text-paper' : 'border-rule bg-paper hover:border-ink'}`}
                    >
                      {label(value)} <span className="font-mono">{count}</span>
                    </button>
                  </li>
                );
              })}
            </ul>
          </fieldset>
        );
      })}
      {(filters.cause || filters.tag || filters.status) && (
        <button type="button" onClick={() => onChange({})} className="self-start text-sm underline underline-offset-2">
          Clear filters
        </button>
      )}
    </div>
  );
}
