import { useState } from 'react';
import type { Case } from '../../../../shared/schemas/case';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import type { CaseFormApi } from '../form/case-form-schema';
import { emptyCaseForm } from '../form/case-form-values';
import { clearLocalDraft, mergeEdits, readLocalDraft, type LocalDraft } from '../hooks/local-draft';

const when = (iso: string) => new Date(iso).toLocaleString([], { dateStyle: 'medium', timeStyle: 'short' });

export interface RestoreDraftBannerProps {
  form: CaseFormApi;
  userId: number;
  caseId: number | null;
  serverCase: Case | null;
}

/** Offers edits kept in this browser that never reached the server (a reload, a lost connection, a conflict). */
export function RestoreDraftBanner({ form, userId, caseId, serverCase }: RestoreDraftBannerProps) {
  const [draft, setDraft] = useState<LocalDraft | null>(() => {
    const d = readLocalDraft(userId, caseId);
    if (!d || JSON.stringify(d.values) === JSON.stringify(form.getValues())) return null;
    return d;
  });
  if (!draft) return null;
  const newer = !serverCase || draft.editedAt > serverCase.updatedAt;
  const restore = () => {
    // only the fields changed in this browser go back; what was saved elsewhere meanwhile stays
    // a draft kept before the form gained fields has no value for them: those take the blank form's
    const values = draft.baseValues ? mergeEdits(draft.baseValues, draft.values, form.getValues()) : mergeEdits(emptyCaseForm(), draft.values, emptyCaseForm());
    form.reset(values, { keepDefaultValues: true });
    setDraft(null);
  };
  const discard = () => {
    clearLocalDraft(userId, caseId);
    setDraft(null);
  };
  return (
    <Alert tone={newer ? 'info' : 'caution'} title="Unsaved edits found in this browser">
      <p>
        {newer
          ? `You made changes at ${when(draft.editedAt)} that did not reach the server.`
          : `These changes from ${when(draft.editedAt)} were made on an older version; the case was saved since (${when(serverCase!.updatedAt)}).`}{' '}
        Restoring puts back the fields you changed and keeps the rest as saved.
      </p>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button type="button" onClick={restore}>
          Restore my edits
        </Button>
        <Button type="button" variant="secondary" onClick={discard}>
          Discard them
        </Button>
      </div>
    </Alert>
  );
}
