import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/Alert';
import { Loading, PageHeader } from '../../../components/ui/Panel';
import { useCase } from '../api/get-case';
import { CaseForm } from './CaseForm';

/**
 * /cases/new (no id) and /cases/:id/edit: loads the case, then hands it to the form. Both
 * addresses render this same component, so when a new case's first save creates it and the
 * address moves to /cases/:id/edit, the very same form stays on screen (focus, cursor and
 * anything typed meanwhile included).
 */
export function CaseEditor({ caseId, userId }: { caseId: number | null; userId: number }) {
  // createdId: the case this form created; arrived: the address has moved on to its /edit page
  const [fresh, setFresh] = useState({ key: 0, createdId: null as number | null, arrived: false });
  if (fresh.createdId !== null && !fresh.arrived && caseId === fresh.createdId) setFresh({ ...fresh, arrived: true });
  // left the case this form created (for another case, or a new one): the next new form starts blank
  const left = fresh.createdId !== null && caseId !== fresh.createdId && (caseId !== null || fresh.arrived);
  if (left) setFresh({ key: fresh.key + 1, createdId: null, arrived: false });
  const query = useCase(caseId ?? 0);
  if (!left && (caseId === null || caseId === fresh.createdId))
    return <CaseForm key={`new-${fresh.key}`} initialCase={null} userId={userId} onCreated={(id) => setFresh((f) => ({ ...f, createdId: id }))} />;
  if (query.isPending) return <Loading what="Loading the case" />;
  if (query.isError)
    return (
      <>
        <PageHeader title="Edit case" />
        <Alert tone="caution" title={query.error.message}>
          <Link to="/cases" className="underline">
            Back to the cases
          </Link>
        </Alert>
      </>
    );
  const c = query.data.case;
  if (!c.permissions.edit)
    return (
      <>
        <PageHeader title="Edit case" />
        <Alert tone="caution" title="This case cannot be edited now">
          <p>
            It is {c.status.replace('_', ' ')}; authors edit their drafts and cases sent back to them.{' '}
            <Link to={`/cases/${c.id}`} className="underline">
              Open the case page
            </Link>
          </p>
        </Alert>
      </>
    );
  return <CaseForm key={c.id} initialCase={c} userId={userId} />;
}
