import { useState } from 'react';
import { CASE_STATUSES, CASE_STATUS_LABELS } from '../../../../shared/schemas/case';
import type { CasebookImportReport, ImportNote } from '../../../../shared/schemas/casebook-archive';
import { CAUSES, CAUSE_LABELS } from '../../../../shared/schemas/diagnosis';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { SelectField, TextField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { casebookExportHref, type CasebookExportFilters } from '../api/export-casebook';
import { useImportCasebook } from '../api/import-casebook';

const CAUSE_OPTIONS = [{ value: '', label: 'Every cause' }, ...CAUSES.map((c) => ({ value: c, label: CAUSE_LABELS[c] })), { value: 'other', label: 'Other causes' }];
const STATUS_OPTIONS = [{ value: '', label: 'Every state' }, ...CASE_STATUSES.map((s) => ({ value: s, label: CASE_STATUS_LABELS[s] }))];

function ExportForm() {
  const [filters, setFilters] = useState<CasebookExportFilters>({});
  const set = (key: keyof CasebookExportFilters) => (e: { target: { value: string } }) => setFilters((f) => ({ ...f, [key]: e.target.value }));
  const filtered = Object.values(filters).some(Boolean);
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-muted">
        A zip with every case as JSON for import elsewhere, and as a Markdown page with its screenshots and captures for reading.
        For moving cases between teams, not a backup.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField label="Cause" options={CAUSE_OPTIONS} value={filters.cause ?? ''} onChange={set('cause')} />
        <SelectField label="State" options={STATUS_OPTIONS} value={filters.status ?? ''} onChange={set('status')} />
        <TextField label="Tag" placeholder="e.g. larkspan" value={filters.tag ?? ''} onChange={set('tag')} />
        <TextField label="Words in title or summary" value={filters.q ?? ''} onChange={set('q')} />
        <TextField label="Updated from" type="date" value={filters.from ?? ''} onChange={set('from')} />
        <TextField label="Updated until" type="date" value={filters.to ?? ''} onChange={set('to')} />
      </div>
      <div>
        <a
          href={casebookExportHref(filters)}
          download
          className="inline-flex items-center rounded-md border border-ink bg-ink px-4 py-2 text-sm font-semibold text-paper hover:opacity-90"
        >
          {filtered ? 'Download the selected cases' : 'Download the whole casebook'}
        </a>
      </div>
    </div>
  );
}

function NoteList({ title, notes }: { title: string; notes: ImportNote[] }) {
  if (notes.length === 0) return null;
  return (
    <details className="rounded-md border border-rule px-3 py-2 text-sm">
      <summary className="cursor-pointer font-semibold">
        {title} ({notes.length})
      </summary>
      <ul className="mt-2 max-h-64 list-disc space-y-1 overflow-y-auto pl-5">
        {notes.map((n, i) => (
          <li key={`${n.kind}-${n.id}-${i}`}>
            <span className="font-mono text-xs">
              {n.kind}
              {n.id !== null ? ` #${n.id}` : ''}
            </span>{' '}
            — {n.reason}
          </li>
        ))}
      </ul>
    </details>
  );
}

function ImportReport({ report }: { report: CasebookImportReport }) {
  const i = report.imported;
  const summary = `${i.cases} cases, ${i.revisions} revisions, ${i.comments} comments, ${i.attachments} attachments, ${i.users} new people`;
  const title =
    i.cases === 0 && report.skipped.length > 0
      ? 'Every case in this archive is already here; nothing new to import.'
      : report.dryRun
        ? `The archive would bring in ${summary}.`
        : `Imported ${summary}.`;
  return (
    <div className="flex flex-col gap-2" data-testid="import-report">
      <Alert tone={report.refused.length ? 'caution' : 'agree'} title={title}>
        {report.dryRun && <p>Nothing has been imported yet.</p>}
        {report.refused.length > 0 && <p>{report.refused.length} records were refused; the list below says why.</p>}
      </Alert>
      {report.notes.map((n) => (
        <p key={n} className="text-sm text-muted">
          {n}
        </p>
      ))}
      <NoteList title="Refused" notes={report.refused} />
      <NoteList title="Already here, skipped" notes={report.skipped} />
    </div>
  );
}

function ImportForm() {
  const [file, setFile] = useState<File | null>(null);
  const run = useImportCasebook();
  const go = (dryRun: boolean) => file && run.mutate({ file, dryRun });
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-muted">
        Brings in an archive exported from Falsetrace. Cases already here (imported before, or the same case by author and creation time) are skipped, and the rest get new numbers here; records that fail the checks are refused and listed. It all goes in at once, or not at all.
      </p>
      <label className="flex flex-col gap-1 text-sm font-semibold">
        Casebook archive (.zip)
        <input
          type="file"
          accept=".zip,application/zip"
          onChange={(e) => {
            setFile(e.target.files?.[0] ?? null);
            run.reset();
          }}
          className="rounded-md border border-rule bg-sheet px-3 py-2 font-normal"
        />
      </label>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" disabled={!file} busy={run.isPending && run.variables?.dryRun} onClick={() => go(true)}>
          Check the archive
        </Button>
        <Button disabled={!file} busy={run.isPending && !run.variables?.dryRun} onClick={() => go(false)}>
          Import
        </Button>
      </div>
      {run.isError && <Alert tone="caution" title="Import refused">{run.error.message}</Alert>}
      {run.data && <ImportReport report={run.data.report} />}
    </div>
  );
}

/** Export and import of the whole casebook, for admins (shown on the People page). */
export function CasebookTransferPanel() {
  return (
    <>
      <div className="mt-6 grid gap-6 lg:grid-cols-2">
        <Panel title="Export the casebook">
          <ExportForm />
        </Panel>
        <Panel title="Import a casebook">
          <ImportForm />
        </Panel>
      </div>
      <p className="mt-3 text-sm text-muted">
        Export and import move cases between teams. To back up this installation — people, reviews, history, settings and every file —{' '}
        <a href="/api/admin/backup" download className="underline">
          download a full backup
        </a>{' '}
        (or run <code>npm run backup</code> on the server); it is brought back whole with <code>npm run restore</code> while the server is stopped, never through Import.
      </p>
    </>
  );
}
