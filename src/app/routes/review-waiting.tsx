import { Link } from 'react-router-dom';
import { Panel } from '../../components/ui/Panel';
import { useReviewCount } from '../../features/review/api/get-review-count';

/** The Bench's note to moderators of how many cases wait on the review desk. */
export function ReviewWaitingPanel() {
  const count = useReviewCount();
  const n = count.data?.waiting;
  return (
    <Panel title="Waiting on the review desk">
      {count.isError && <p className="text-sm text-caution">{count.error.message}</p>}
      {n !== undefined && (
        <p className="text-sm">
          <span className="font-mono text-2xl">{n}</span> {n === 1 ? 'case waits' : 'cases wait'} for a moderator.{' '}
          <Link to="/review" className="font-semibold underline underline-offset-2">
            Open the review desk
          </Link>
        </p>
      )}
    </Panel>
  );
}
