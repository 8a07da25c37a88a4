import { useId, useState, type ReactNode } from 'react';
import type { Attachment } from '../../../../shared/schemas/case';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { ConfirmDialog } from '../../../components/ui/Dialog';
import { useDeleteAttachment } from '../api/delete-attachment';
import type { UploadItem } from '../hooks/use-attachment-uploads';
import { FormSection } from './FormSection';
import { fileSize } from './file-size';

export interface AttachmentsSectionProps {
  caseId: number | null;
  attachments: Attachment[];
  uploads: UploadItem[];
  onFiles: (files: File[]) => void;
  onDismiss: (key: string) => void;
  /** Shown under the attached files for each capture (the offer to fill the observed values). */
  renderCaptureOffer?: (capture: Attachment) => ReactNode;
}

export function AttachmentsSection({ caseId, attachments, uploads, onFiles, onDismiss, renderCaptureOffer }: AttachmentsSectionProps) {
  const inputId = useId();
  const [over, setOver] = useState(false);
  const [removing, setRemoving] = useState<Attachment | null>(null);
  const [error, setError] = useState('');
  const remove = useDeleteAttachment();
  const confirmRemove = () => {
    if (!removing || caseId === null) return;
    remove.mutate(
      { caseId, attachmentId: removing.id },
      { onError: (e) => setError(`${removing.originalName}: ${e.message}`), onSettled: () => setRemoving(null) },
    );
  };
  return (
    <FormSection id="attachments" title="Attachments" lead="Screenshots of the trace (PNG, JPEG, GIF, BMP, up to 10 MB) and the waveform capture as CSV (up to 2 GB unless your server sets another limit).">
      <div
        data-testid="drop-zone"
        onDragOver={(e) => {
          if (!e.dataTransfer.types.includes('Files')) return;
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={(e) => {
          e.preventDefault();
          e.stopPropagation();
          setOver(false);
          onFiles([...e.dataTransfer.files]);
        }}
        className={`flex flex-col items-center gap-2 rounded-lg border-2 border-dashed px-4 py-6 text-center text-sm ${over ? 'border-agree bg-agree-soft' : 'border-rule'}`}
      >
        <p>
          Drop files here, or paste a screenshot (<kbd className="font-mono">Ctrl</kbd>+<kbd className="font-mono">V</kbd>) anywhere on this form.
        </p>
        <label htmlFor={inputId} className="cursor-pointer rounded-md border border-rule bg-sheet px-3 py-1.5 font-semibold hover:border-ink focus-within:outline">
          Choose files…
          <input
            id={inputId}
            type="file"
            multiple
            accept="image/png,image/jpeg,image/gif,image/bmp,.csv,.tsv,.txt,text/csv"
            className="sr-only"
            onChange={(e) => {
              onFiles([...(e.target.files ?? [])]);
              e.target.value = '';
            }}
          />
        </label>
        {caseId === null && <p className="text-xs text-muted">Files attach once the draft is saved (it needs a title and a one-line summary).</p>}
      </div>
      {error && <Alert tone="caution">{error}</Alert>}
      {uploads.length > 0 && (
        <ul className="flex flex-col gap-2" aria-label="Uploads">
          {uploads.map((u) => (
            <li key={u.key} className="rounded-md border border-rule px-3 py-2 text-sm">
              <div className="flex items-center justify-between gap-2">
                <span className="truncate font-mono text-xs">{u.name}</span>
                <span className="shrink-0 font-mono text-xs text-muted">{fileSize(u.sizeBytes)}</span>
              </div>
              {u.state !== 'failed' && <progress className="mt-1 h-2 w-full accent-[var(--ft-agree)]" max={1} value={u.progress} aria-label={`Uploading ${u.name}`} />}
              {u.state === 'failed' && (
                <div className="mt-1 flex items-start justify-between gap-2">
                  <p role="alert" className="text-xs font-semibold text-caution">
                    {u.error}
                  </p>
                  <button type="button" className="text-xs underline" onClick={() => onDismiss(u.key)}>
                    Dismiss
                  </button>
                </div>
              )}
            </li>
          ))}
        </ul>
      )}
      {attachments.length > 0 && (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3" aria-label="Attached files">
          {attachments.map((a) => (
            <li key={a.id} className="flex flex-col overflow-hidden rounded-md border border-rule bg-paper">
              {a.kind === 'screenshot' && a.thumbnailUrl ? (
                <img src={a.thumbnailUrl} alt={`Screenshot ${a.originalName}`} className="aspect-[4/3] w-full object-contain bg-sheet" />
              ) : (
                <div className="flex aspect-[4/3] items-center justify-center bg-sheet font-mono text-xs text-muted">CSV capture</div>
              )}
              <div className="flex flex-1 flex-col gap-1 p-2 text-xs">
                <span className="truncate font-mono" title={a.originalName}>
                  {a.originalName}
                </span>
                <span className="font-mono text-muted">{fileSize(a.sizeBytes)}</span>
                <Button type="button" variant="quiet" className="mt-auto self-start px-2! py-1!" onClick={() => setRemoving(a)}>
                  Remove<span className="sr-only"> {a.originalName}</span>
                </Button>
              </div>
            </li>
          ))}
        </ul>
      )}
      {renderCaptureOffer && attachments.filter((a) => a.kind === 'capture').map((a) => <div key={a.id}>{renderCaptureOffer(a)}</div>)}
      <ConfirmDialog
        open={removing !== null}
        title="Remove this attachment?"
        confirmLabel="Remove"
        tone="danger"
        busy={remove.isPending}
        onConfirm={confirmRemove}
        onCancel={() => setRemoving(null)}
      >
        <p>
          <span className="font-mono">{removing?.originalName}</span> will be deleted from the case.
        </p>
      </ConfirmDialog>
    </FormSection>
  );
}
