import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { Case } from '../../../../shared/schemas/case';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { ConfirmDialog } from '../../../components/ui/Dialog';
import { ApiError } from '../../../lib/api-client';
import { useDeleteCase } from '../api/delete-case';
import { useSubmitCase } from '../api/submit-case';

export interface CaseFormActionsProps {
  caseId: number | null;
  current: Case | null;
  /** Saves every pending change; false when that failed (the status line says why). */
  flush: () => Promise<boolean>;
}

/** Save now, submit for review (after saving), and throwing away an unsubmitted draft. */
export function CaseFormActions({ caseId, current, flush }: CaseFormActionsProps) {
  const navigate = useNavigate();
  const submit = useSubmitCase();
  const remove = useDeleteCase();
  const [asking, setAsking] = useState<'submit' | 'delete' | null>(null);
  const [problem, setProblem] = useState<{ message: string; issues: string[] } | null>(null);

  const doSubmit = async () => {
    if (caseId === null) return;
    setProblem(null);
    if (!(await flush())) {
      setAsking(null);
      setProblem({ message: 'The draft could not be saved, so it was not submitted. See the status above.', issues: [] });
      return;
    }
    try {
      await submit.mutateAsync(caseId);
      navigate(`/cases/${caseId}`);
    } catch (err) {
      setAsking(null);
      setProblem({ message: err instanceof Error ? err.message : 'Submitting failed', issues: err instanceof ApiError ? err.issues.map((i) => i.message) : [] });
    }
  };
  const doDelete = () => {
    if (caseId === null) return;
    remove.mutate(caseId, {
      onSuccess: () => navigate('/cases'),
      onError: (err) => {
        setAsking(null);
        setProblem({ message: err.message, issues: [] });
      },
    });
  };

  return (
    <>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="secondary">
          Save now
        </Button>
        {current?.permissions.submit && (
          <Button type="button" onClick={() => setAsking('submit')}>
            Submit for review
          </Button>
        )}
        {current?.status === 'draft' && current.permissions.submit && (
          <Button type="button" variant="quiet" onClick={() => setAsking('delete')}>
            Delete draft
          </Button>
        )}
      </div>
      {problem && (
        <div className="basis-full">
          <Alert tone="caution" title="Not submitted">
            <p>{problem.message}</p>
            {problem.issues.length > 0 && (
              <ul className="mt-1 list-disc pl-5">
                {problem.issues.map((i) => (
                  <li key={i}>{i}</li>
                ))}
              </ul>
            )}
          </Alert>
        </div>
      )}
      <ConfirmDialog
        open={asking === 'submit'}
        title="Submit this case for review?"
        confirmLabel="Submit for review"
        busy={submit.isPending}
        onConfirm={() => void doSubmit()}
        onCancel={() => setAsking(null)}
      >
        <p>A moderator checks the setup, the engine's view and the lesson, then verifies it or sends it back with notes. You cannot edit it while it is in review.</p>
      </ConfirmDialog>
      <ConfirmDialog
        open={asking === 'delete'}
        title="Delete this draft?"
        confirmLabel="Delete draft"
        tone="danger"
        busy={remove.isPending}
        onConfirm={doDelete}
        onCancel={() => setAsking(null)}
      >
        <p>The draft and its attachments are deleted for good.</p>
      </ConfirmDialog>
    </>
  );
}
