import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { setupSafetyReasons } from '../../../../shared/safety/iec-61010';
import type { Attachment, Case } from '../../../../shared/schemas/case';
import { Alert } from '../../../components/ui/Alert';
import { Markdown } from '../../../components/ui/Markdown';
import { ReferredBy } from './ReferredBy';
import { Loading, Panel } from '../../../components/ui/Panel';
import { SafetyCaution } from '../../../components/ui/SafetyCaution';
import { ApiError } from '../../../lib/api-client';
import { useCase } from '../api/get-case';
import { CaptureList } from './CaptureList';
import { CasePageActions } from './CasePageActions';
import { CauseChip, causeLabel } from '../../../components/ui/CauseChip';
import { CommentsSection } from './CommentsSection';
import { DiagnosisView } from './DiagnosisView';
import { ExpectedVsObserved } from './ExpectedVsObserved';
import { RevisionHistory } from './RevisionHistory';
import { ScreenshotGallery } from './ScreenshotGallery';
import { SetupCard } from './SetupCard';
import { StatusBadge } from './StatusBadge';

const day = (iso: string) => new Date(iso).toLocaleDateString([], { dateStyle: 'medium' });

function Section({ id, title, children, className = '' }: { id: string; title: string; children: ReactNode; className?: string }) {
  return (
    <Panel className={`min-w-0 ${className}`}>
      <h2 id={id} className="mb-3 text-lg">
        {title}
      </h2>
      {children}
    </Panel>
  );
}

function CauseChips({ c }: { c: Case }) {
  const engine = c.diagnosis?.hypotheses[0];
  const verdict = c.diagnosis?.verdict;
  const observedSomething = Object.values(c.setup?.observed ?? {}).some((v) => typeof v === 'number' || typeof v === 'boolean');
  // the chip names what the engine really concluded: a fitting cause, a true trace once something
  // was observed, or nothing at all while the verdict rests on an empty observation
  const engineCause =
    engine && verdict === 'measurement-error' && engine.fits ? engine.cause : engine && verdict === 'faithful' && observedSomething ? 'faithful' : null;
  const stated = c.statedCause === 'other' ? `Other: ${c.statedCauseOther ?? 'unnamed'}` : c.statedCause;
  return (
    <ul className="flex flex-wrap items-center gap-2" aria-label="Causes">
      {c.statedCause && (
        <li>
          <span className="mr-1 text-xs text-muted">Stated</span>
          <CauseChip cause={c.statedCause === 'other' ? 'other' : c.statedCause} title={stated ?? undefined} tone={c.disagreesWithEngine ? 'plain' : 'agree'} />
          {c.statedCause === 'other' && c.statedCauseOther && <span className="ml-1 text-xs">({c.statedCauseOther})</span>}
        </li>
      )}
      {verdict === 'unexplained' && (
        <li className="text-xs text-muted">
          Engine: <span className="text-caution">nothing it models fits</span>
        </li>
      )}
      {engineCause && (
        <li>
          <span className="mr-1 text-xs text-muted">Engine</span>
          <CauseChip
            cause={engineCause}
            tone={c.disagreesWithEngine ? 'caution' : c.statedCause === engineCause ? 'agree' : 'plain'}
            title={c.disagreesWithEngine ? `The engine ranks ${causeLabel(engineCause)} first, not the stated cause` : undefined}
          />
        </li>
      )}
    </ul>
  );
}

export interface CasePageProps {
  caseId: number;
  /** The plot of one capture attachment; the route supplies it, since it belongs to the captures feature. */
  renderCapturePlot?: (capture: Attachment, c: Case) => ReactNode;
  /** The captures marked before and after the fix, compared (the captures feature supplies it). */
  renderCaptureComparison?: (c: Case) => ReactNode;
  /** Slots the route fills from other features: a watch button, the audit trail, similar cases. */
  headerExtras?: ReactNode;
  afterHistory?: ReactNode;
  sideExtras?: ReactNode;
}

export function CasePage({ caseId, renderCapturePlot, renderCaptureComparison, headerExtras, afterHistory, sideExtras }: CasePageProps) {
  const q = useCase(caseId);
  if (q.isPending) return <Loading what="Loading the case" />;
  if (q.isError) {
    const missing = q.error instanceof ApiError && q.error.status === 404;
    return (
      <Alert tone="caution" title={missing ? 'No such case' : q.error.message}>
        <p>
          {missing ? 'It does not exist, or it is not visible to you yet. ' : ''}
          <Link to="/cases" className="underline">
            Back to the cases
          </Link>
        </p>
      </Alert>
    );
  }
  const c = q.data.case;
  const engineTags = new Set(c.diagnosis?.tags ?? []);
  const shots = c.attachments.filter((a) => a.kind === 'screenshot');
  const captures = c.attachments.filter((a) => a.kind === 'capture');
  const setupReasons = setupSafetyReasons(c.setup.circuit);
  return (
    <article aria-labelledby="case-title" className="flex flex-col gap-6">
      <header className="flex flex-col gap-3 border-b border-rule pb-4">
        <div className="flex flex-wrap items-center gap-2 text-sm text-muted">
          <Link to="/cases" className="underline underline-offset-2">
            Cases
          </Link>
          <span aria-hidden>/</span>
          <span className="font-mono">#{c.id}</span>
        </div>
        <div className="flex flex-wrap items-start justify-between gap-4">
          <div className="min-w-0 flex-1">
            <h1 id="case-title" className="font-serif text-2xl break-words sm:text-3xl">
              {c.title}
            </h1>
            <p className="mt-1 text-lg">{c.summary}</p>
          </div>
          <div className="flex flex-wrap items-center gap-2">
            {headerExtras}
            <CasePageActions c={c} />
          </div>
        </div>
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
          <StatusBadge status={c.status} />
          <CauseChips c={c} />
          {c.tags.length > 0 && (
            <ul className="flex flex-wrap gap-1" aria-label="Tags">
              {c.tags.map((t) => {
                const byEngine = engineTags.has(t);
                return (
                  <li key={t} title={byEngine ? 'Tag added by the diagnosis engine' : undefined} className={`rounded-full border px-2 py-0.5 font-mono text-xs ${byEngine ? 'border-dashed border-muted text-muted' : 'border-rule'}`}>
                    {t}
                  </li>
                );
              })}
            </ul>
          )}
          <span className="text-sm text-muted">
            {c.authorName} · updated {day(c.updatedAt)}
          </span>
        </div>
      </header>
      {c.status === 'needs_changes' && c.reviewNote && (
        <Alert tone="caution" title="Sent back by the reviewer">
          <p className="whitespace-pre-line">{c.reviewNote}</p>
        </Alert>
      )}
      <SafetyCaution risks={c.diagnosis?.risks ?? []} setupReasons={setupReasons} />
      {c.safetyNote && (
        <section aria-labelledby="safety-note-title" className="rounded-md border border-l-4 border-rule border-l-hazard bg-sheet px-4 py-3 text-sm">
          <h2 id="safety-note-title" className="font-sans text-sm font-semibold">
            Safety note
          </h2>
          <p className="mt-0.5 whitespace-pre-line">{c.safetyNote}</p>
        </section>
      )}
      {/* phones: one column in reading order (setup and diagnosis early); desktop: two columns */}
      <div className="flex flex-col gap-6 lg:grid lg:grid-cols-[minmax(0,1fr)_22rem] lg:items-start">
        <div className="contents lg:flex lg:min-w-0 lg:flex-col lg:gap-6">
          <Section id="expected-observed" title="Expected and observed" className="order-1 lg:order-none">
            <ExpectedVsObserved setup={c.setup} />
          </Section>
          {(shots.length > 0 || captures.length > 0) && (
            <Section id="attachments" title="Screenshots and captures" className="order-4 lg:order-none">
              <div className="flex flex-col gap-4">
                <ScreenshotGallery shots={shots} />
                {renderCaptureComparison?.(c)}
                <CaptureList captures={captures} renderPlot={renderCapturePlot && ((a) => renderCapturePlot(a, c))} />
              </div>
            </Section>
          )}
          {c.narrative && (
            <Section id="narrative" title="What happened" className="order-5 lg:order-none">
              <Markdown references={c.references}>{c.narrative}</Markdown>
            </Section>
          )}
          {(c.fix || c.lessonSummary) && (
            <section aria-label="Fix and lesson" className="order-6 rounded-lg lg:order-none border border-l-8 border-rule border-l-agree bg-agree-soft/60 p-5">
              {c.lessonSummary && (
                <>
                  <h2 className="text-sm font-sans font-semibold tracking-wide text-agree uppercase">Lesson</h2>
                  <p className="mt-1 font-serif text-lg">{c.lessonSummary}</p>
                  {c.lessonDetail && (
                    <Markdown className="mt-1 text-sm" references={c.references}>
                      {c.lessonDetail}
                    </Markdown>
                  )}
                </>
              )}
              {c.fix && (
                <p className={`text-sm ${c.lessonSummary ? 'mt-3 border-t border-rule pt-3' : ''}`}>
                  <span className="font-semibold">Fix: </span>
                  <span className="whitespace-pre-line">{c.fix}</span>
                </p>
              )}
            </section>
          )}
          <Section id="comments" title="Comments" className="order-7 lg:order-none">
            <CommentsSection caseId={c.id} canComment={c.permissions.comment} />
          </Section>
          <Section id="history" title="Revision history" className="order-8 lg:order-none">
            <RevisionHistory caseId={c.id} />
          </Section>
          {afterHistory && <div className="order-9 lg:order-none">{afterHistory}</div>}
        </div>
        <div className="contents lg:flex lg:min-w-0 lg:flex-col lg:gap-6">
          <Section id="setup" title="Setup" className="order-2 lg:order-none">
            <SetupCard setup={c.setup} />
          </Section>
          <Section id="diagnosis" title="Engine's diagnosis" className="order-3 lg:order-none">
            {c.diagnosis ? (
              <>
                {c.disagreesWithEngine && (
                  <p className="mb-3 rounded-md border-l-4 border-caution bg-caution-soft px-3 py-2 text-xs">The engine ranks a different cause first than the one stated.</p>
                )}
                <DiagnosisView result={c.diagnosis} observed={c.setup.observed} limit={6} />
              </>
            ) : (
              <p className="text-sm text-muted">No diagnosis stored for this case.</p>
            )}
          </Section>
          {c.referredBy.length > 0 && (
            <Section id="referred-by" title="Referred to by" className="order-9 lg:order-none">
              <ReferredBy cases={c.referredBy} />
            </Section>
          )}
          {sideExtras && <div className="order-10 lg:order-none">{sideExtras}</div>}
        </div>
      </div>
    </article>
  );
}
