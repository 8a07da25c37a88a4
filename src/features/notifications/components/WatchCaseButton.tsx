import { Button } from '../../../components/ui/Button';
import { useWatches } from '../api/get-watches';
import { useSetCaseWatch } from '../api/watch-case';

/**
 * Watch or stop watching one case (mails on its comments, verification, retirement, as the
 * person's notification settings say). For the case page: `<WatchCaseButton caseId={c.id} />`.
 */
export function WatchCaseButton({ caseId, className = '' }: { caseId: number; className?: string }) {
  const watches = useWatches();
  const set = useSetCaseWatch();
  const watching = watches.data?.cases.includes(caseId) ?? false;
  return (
    <Button
      type="button"
      variant="secondary"
      className={className}
      aria-pressed={watching}
      disabled={!watches.data}
      busy={set.isPending}
      title={set.error?.message ?? (watching ? 'You get mails about this case; click to stop' : 'Get mails about this case')}
      onClick={() => set.mutate({ caseId, watching: !watching })}
    >
      {watching ? 'Watching ✓' : 'Watch'}
    </Button>
  );
}
