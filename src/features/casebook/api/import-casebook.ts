import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CasebookImportReport } from '../../../../shared/schemas/casebook-archive';
import { api } from '../../../lib/api-client';

export interface ImportCasebookInput {
  file: File;
  /** Check the archive and report, without importing anything. */
  dryRun: boolean;
}

export function importCasebook({ file, dryRun }: ImportCasebookInput) {
  const body = new FormData();
  body.append('file', file);
  return api<{ report: CasebookImportReport }>(`/api/admin/casebook/import${dryRun ? '?dryRun=1' : ''}`, { method: 'POST', body });
}

export function useImportCasebook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: importCasebook,
    // an import adds cases, people, lessons and search results: everything that lists them refetches
    onSuccess: ({ report }) => {
      if (!report.dryRun) void qc.invalidateQueries();
    },
  });
}
