import { canModerate } from '../../../shared/auth/roles';
import { PageHeader, Panel } from '../../components/ui/Panel';
import { useMe } from '../../features/auth/api/get-me';

// The symptom words engineers use at the bench; search (issue: search) turns them into observations.
const SYMPTOMS = [
  'Amplitude off by a round factor',
  'Ringing after edges',
  'Rounded edges',
  'Spikes on square-wave corners',
  'Amplitude falls with frequency',
  'DC level sags',
];

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
          <label htmlFor="bench-search" className="text-sm font-semibold">
            Symptom search
          </label>
          <input
            id="bench-search"
            disabled
            placeholder="e.g. reads a tenth of the expected 3.3 V"
            className="mt-1 w-full rounded-md border border-rule bg-paper px-3 py-3 text-lg"
            aria-describedby="bench-search-note"
          />
          <p id="bench-search-note" className="mt-2 text-xs text-muted">
            Search is not built yet; it arrives with the search work.
          </p>
          <ul className="mt-4 flex flex-wrap gap-2" aria-label="Common symptoms">
            {SYMPTOMS.map((s) => (
              <li key={s} className="rounded-full border border-rule px-3 py-1 text-sm text-muted">
                {s}
              </li>
            ))}
          </ul>
        </Panel>
        <div className="grid gap-6 md:grid-cols-2">
          <Panel title="Recently verified">
            <p className="text-sm text-muted">Cases are not built yet; verified cases will be listed here.</p>
          </Panel>
          <Panel title="My drafts">
            <p className="text-sm text-muted">Your unfinished write-ups will wait here once filing cases is built.</p>
          </Panel>
          {canModerate(user) && (
            <Panel title="Waiting on the review desk">
              <p className="text-sm text-muted">The review desk is not built yet; the number of cases to review will show here.</p>
            </Panel>
          )}
        </div>
      </div>
    </>
  );
}
