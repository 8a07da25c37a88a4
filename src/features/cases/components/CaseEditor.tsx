import { Link } from 'react-router-dom';
import { Alert } from '../../../components/ui/Alert';
import { Loading, PageHeader } from '../../../components/ui/Panel';
import { useCase } from '../api/get-case';
import { CaseForm } from './CaseForm';

/** /cases/new (no id) and /cases/:id/edit: loads the case, then hands it to the form. */
export function CaseEditor({ caseId, userId }: { caseId: number | null; userId: number }) {
  const query = useCase(caseId ?? 0);
  if (caseId === null) return <CaseForm key="new" initialCase={null} userId={userId} />;
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
