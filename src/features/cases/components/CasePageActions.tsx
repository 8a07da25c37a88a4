import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { Case } from '../../../../shared/schemas/case';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { ConfirmDialog } from '../../../components/ui/Dialog';
import { ApiError } from '../../../lib/api-client';
import { useSubmitCase } from '../api/submit-case';

/** Edit and Submit, each shown only when the case's permissions allow it. */
export function CasePageActions({ c }: { c: Case }) {
  const submit = useSubmitCase();
  const [asking, setAsking] = useState(false);
  const [problem, setProblem] = useState<ApiError | Error | null>(null);
  if (!c.permissions.edit && !c.permissions.submit) return null;
  return (
    <div className="flex flex-col items-end gap-2">
      <div className="flex flex-wrap gap-2">
        {c.permissions.edit && (
          <Link to={`/cases/${c.id}/edit`} className="inline-flex items-center rounded-md border border-rule bg-sheet px-4 py-2 text-sm font-semibold hover:border-ink">
            Edit
          </Link>
        )}
        {c.permissions.submit && (
          <Button type="button" onClick={() => setAsking(true)}>
            Submit for review
          </Button>
        )}
      </div>
      {problem && (
        <Alert tone="caution" title="Not submitted">
          <p>{problem.message}</p>
          {problem instanceof ApiError && problem.issues.length > 0 && (
            <ul className="mt-1 list-disc pl-5">
              {problem.issues.map((i) => (
                <li key={i.path + i.message}>{i.message}</li>
              ))}
            </ul>
          )}
        </Alert>
      )}
      <ConfirmDialog
        open={asking}
        title="Submit this case for review?"
        confirmLabel="Submit for review"
        busy={submit.isPending}
        onCancel={() => setAsking(false)}
        onConfirm={() =>
          submit.mutate(c.id, {
            onError: (e) => setProblem(e),
            onSuccess: () => setProblem(null),
            onSettled: () => setAsking(false),
          })
        }
      >
        <p>A moderator checks the setup, the engine's view and the lesson, then verifies it or sends it back with notes. You cannot edit it while it is in review.</p>
      </ConfirmDialog>
    </div>
  );
}
