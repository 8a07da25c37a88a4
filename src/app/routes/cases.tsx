import { lazy, Suspense } from 'react';
import { useParams } from 'react-router-dom';
import { PageHeader, Panel } from '../../components/ui/Panel';
import { useMe } from '../../features/auth/api/get-me';
import { CaseEditor } from '../../features/cases/components/CaseEditor';
import { CasePage } from '../../features/cases/components/CasePage';
import { CasesPage } from '../../features/cases/components/CasesPage';
import { WatchCaseButton } from '../../features/notifications/components/WatchCaseButton';
import { CaseHistory } from '../../features/review/components/CaseHistory';
import { SimilarCases } from '../../features/search/components/SimilarCases';

function useCaseId(): number | null {
  const { id } = useParams();
  const n = Number(id);
  return Number.isInteger(n) && n > 0 ? n : null;
}

function NoSuchCase() {
  return (
    <>
      <PageHeader title="No such case" />
      <Panel>
        <p className="text-muted">Case addresses look like /cases/12.</p>
      </Panel>
    </>
  );
}

// the plot code (and uPlot) is fetched only when a case with a capture is opened
const CapturePlot = lazy(() => import('../../features/captures/components/CapturePlot'));
const CaptureBeforeAfter = lazy(() => import('../../features/captures/components/CaptureBeforeAfter'));

export const CasesRoute = CasesPage;

/** /cases/new and /cases/:id/edit share this component, so a new case's editor survives its own creation. */
export function CaseEditorRoute() {
  const { user } = useMe();
  const isNew = useParams().id === undefined;
  const id = useCaseId();
  if (!isNew && id === null) return <NoSuchCase />;
  return user ? <CaseEditor caseId={id} userId={user.id} /> : null;
}

export function CaseRoute() {
  const id = useCaseId();
  if (id === null) return <NoSuchCase />;
  return (
    <CasePage
      caseId={id}
      headerExtras={<WatchCaseButton caseId={id} />}
      sideExtras={
        <Panel title="Similar cases">
          <SimilarCases caseId={id} />
        </Panel>
      }
      afterHistory={
        <Panel title="State changes and moderator edits">
          <CaseHistory caseId={id} />
        </Panel>
      }
      renderCapturePlot={(capture, c) => (
        <Suspense fallback={<p className="text-sm text-muted">Loading the plot…</p>}>
          <CapturePlot attachment={capture} setup={c.setup} diagnosis={c.diagnosis} canEdit={c.permissions.edit} />
        </Suspense>
      )}
      renderCaptureComparison={(c) => {
        const before = c.attachments.find((a) => a.kind === 'capture' && a.captureRole === 'before');
        const after = c.attachments.find((a) => a.kind === 'capture' && a.captureRole === 'after');
        return before && after ? (
          <Suspense fallback={<p className="text-sm text-muted">Loading the comparison…</p>}>
            <CaptureBeforeAfter before={before} after={after} />
          </Suspense>
        ) : null;
      }}
    />
  );
}
