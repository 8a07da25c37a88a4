import { hypothesisName, verdictLead } from '../../../lib/hypothesis-words';
import { hasObservation } from '../form/read-form';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { useDiagnoseForm } from '../hooks/use-diagnose-form';
import { DiagnoseForm } from './DiagnoseForm';
import { DiagnosisResults } from './DiagnosisResults';

/** The engine on its own: setup and observation in, ranked causes out. */
export function DiagnosePage() {
  const form = useDiagnoseForm();
  const top = form.local.hypotheses[0];
  const verdict = form.local.verdict;
  const judged = hasObservation(form.input);
  const lead = (judged && verdictLead(form.local)) || top;
  const short = !judged ? 'Most likely' : verdict === 'faithful' ? 'The trace is true' : verdict === 'unexplained' ? 'Nothing fits' : 'Misleads';
  return (
    <>
      <PageHeader
        title="Diagnose"
        lead={
          <>
            Describe the probe, the channel and what the trace showed; the engine ranks the measurement errors that would explain it. Type values with
            units or prefixes: <span className="font-mono text-ink">10 pF</span>, <span className="font-mono text-ink">9 MΩ</span>,{' '}
            <span className="font-mono text-ink">2.5 ns</span>, <span className="font-mono text-ink">500m</span>.
          </>
        }
      />
      <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
        <div className="flex min-w-0 flex-col gap-3">
          <Panel className="min-w-0">
            <DiagnoseForm form={form} assumptions={form.local.assumptions} />
          </Panel>
          {top && (
            // On one column the results sit below a long form: keep the verdict in sight while typing.
            <a
              href="#diagnosis-results"
              className="sticky bottom-3 z-10 flex items-center justify-between gap-3 rounded-lg bg-ink px-4 py-2.5 text-sm text-paper shadow-lg lg:hidden"
            >
              <span className="min-w-0 truncate">
                {short}
                {(!judged || verdict === 'measurement-error') && (
                  <>
                    : <span className="font-semibold">{hypothesisName(lead)}</span>
                  </>
                )}
              </span>
              <span className="shrink-0 font-mono text-xs">{Math.round(top.likelihood * 100)} % ↓</span>
            </a>
          )}
        </div>
        <DiagnosisResults result={form.local} input={form.input} server={form.server} unreadable={form.unreadable} />
      </div>
    </>
  );
}
