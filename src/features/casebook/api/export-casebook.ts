import type { CasebookExportQuery } from '../../../../shared/schemas/casebook-archive';

export type CasebookExportFilters = Partial<Record<keyof CasebookExportQuery, string>>;

/**
 * The download address of the archive for these filters. A plain link, not a fetch: the
 * browser streams a large zip to disk itself and the session cookie goes with it.
 */
export function casebookExportHref(filters: CasebookExportFilters): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(filters)) if (v) params.set(k, v);
  const qs = params.toString();
  return `/api/admin/casebook/export${qs ? `?${qs}` : ''}`;
}
