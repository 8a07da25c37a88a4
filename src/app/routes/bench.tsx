import { canModerate } from '../../../shared/auth/roles';
import { PageHeader, Panel } from '../../components/ui/Panel';
import { Link } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { CaseMiniList } from '../../features/cases/components/CaseMiniList';
import { ReviewWaitingPanel } from './review-waiting';
import { BenchSearch } from '../../features/search/components/BenchSearch';
import { SaveSearchButton } from '../../features/saved-searches/components/SaveSearchButton';

export function BenchRoute() {
  const { user } = useMe();
  return (
    <>
      <PageHeader
        title="What is the trace doing?"
        lead="Describe the waveform that looks wrong — before you debug the circuit, check whether the measurement lied."
      />
      <div className="flex flex-col gap-6">
        <Panel>
          <BenchSearch actions={(current) => <SaveSearchButton search={current} />} />
        </Panel>
        <div className="grid gap-6 md:grid-cols-2">
          <Panel title="Recently verified">
            <CaseMiniList filters={{ status: 'verified', pageSize: '5' }} empty="No verified cases yet." moreLabel="All verified cases" />
          </Panel>
          <Panel
            title="My drafts"
            actions={
              <Link to="/cases/new" className="text-sm font-semibold underline underline-offset-2">
                New case
              </Link>
            }
          >
            {user && (
              <CaseMiniList filters={{ status: 'draft', author: String(user.id) }} empty="No drafts waiting. Seen a trace that lied? File it." moreLabel="All my drafts" editLinks />
            )}
          </Panel>
          {canModerate(user) && (
            <ReviewWaitingPanel />
          )}
        </div>
      </div>
    </>
  );
}
