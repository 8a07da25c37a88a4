import { useCallback, useEffect, useState } from 'react';
import { useWatch } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import { setupSafetyReasons } from '../../../../shared/safety/iec-61010';
import type { Case } from '../../../../shared/schemas/case';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { SafetyCaution } from '../../../components/ui/SafetyCaution';
import { SectionNav } from '../../../components/ui/SectionNav';
import { useZodForm } from '../../../lib/forms';
import { readQuantity } from '../../../lib/quantity';
import { useCase } from '../api/get-case';
import { caseFormSchema } from '../form/case-form-schema';
import { caseToFormValues } from '../form/case-form-values';
import { useAttachmentUploads } from '../hooks/use-attachment-uploads';
import { useCaseAutosave } from '../hooks/use-case-autosave';
import { useLiveDiagnosis } from '../hooks/use-live-diagnosis';
import { usePasteFiles } from '../hooks/use-paste-files';
import { AttachmentsSection } from './AttachmentsSection';
import { AutosaveStatus } from './AutosaveStatus';
import { CaseFormActions } from './CaseFormActions';
import { CauseSection } from './CauseSection';
import { FillObservedFromCapture } from './FillObservedFromCapture';
import { FillSetupFromCapture } from './FillSetupFromCapture';
import { LessonSection } from './LessonSection';
import { LiveDiagnosisPanel } from './LiveDiagnosisPanel';
import { RestoreDraftBanner } from './RestoreDraftBanner';
import { SetupSection } from './SetupSection';
import { SignalSection } from './SignalSection';
import { StatusBadge } from './StatusBadge';
import { WhatHappenedSection } from './WhatHappenedSection';

const SECTIONS = [
  { id: 'what-happened', title: 'What happened' },
  { id: 'setup', title: 'Setup' },
  { id: 'signal', title: 'Signal and observation' },
  { id: 'attachments', title: 'Attachments' },
  { id: 'cause', title: 'Root cause and fix' },
  { id: 'lesson', title: 'Lesson' },
];

export interface CaseFormProps {
  initialCase: Case | null;
  userId: number;
  /** The first save of a new case created it; the same form carries on at its /edit address. */
  onCreated?: (caseId: number) => void;
}

/** The case editor: six sections, autosaved as a draft, with the engine's live view beside it. */
export function CaseForm({ initialCase, userId, onCreated }: CaseFormProps) {
  const navigate = useNavigate();
  const [initialValues] = useState(() => caseToFormValues(initialCase));
  const form = useZodForm(caseFormSchema, initialValues);
  const [caseId, setCaseId] = useState<number | null>(initialCase?.id ?? null);
  const created = useCallback(
    (c: Case) => {
      setCaseId(c.id);
      onCreated?.(c.id);
      navigate(`/cases/${c.id}/edit`, { replace: true });
    },
    [navigate, onCreated],
  );
  const autosave = useCaseAutosave({ form, userId, initialCase, onCreated: created });
  const live = useCase(caseId ?? 0);
  const current = live.data?.case ?? initialCase;
  const { adoptServerCase } = autosave;
  useEffect(() => {
    if (live.data) adoptServerCase(live.data.case);
  }, [adoptServerCase, live.data]);

  const uploads = useAttachmentUploads(caseId);
  usePasteFiles(uploads.start);

  const circuit = useWatch({ control: form.control, name: 'setup.circuit' });
  const volts = readQuantity(circuit.highestVoltageV, 'V');
  const reference = readQuantity(circuit.referenceV, 'V');
  const setupReasons = setupSafetyReasons({
    mainsConnected: circuit.mainsConnected === 'yes',
    highestVoltageV: volts.kind === 'ok' ? volts.value : undefined,
    referenceV: reference.kind === 'ok' ? reference.value : undefined,
  });
  const liveDiagnosis = useLiveDiagnosis(form);
  const risks = liveDiagnosis.result?.risks ?? [];

  const reloadSaved = () => window.location.reload();

  return (
    <form
      noValidate
      aria-label={caseId ? 'Edit case' : 'New case'}
      onSubmit={(e) => {
        e.preventDefault();
        void autosave.flush();
      }}
      onDragOver={(e) => e.dataTransfer.types.includes('Files') && e.preventDefault()}
      onDrop={(e) => {
        if (e.dataTransfer.files.length === 0) return;
        e.preventDefault();
        uploads.start([...e.dataTransfer.files]);
      }}
      className="flex flex-col gap-5"
    >
      <div className="-mx-4 border-b border-rule bg-paper/95 px-4 py-3 backdrop-blur sm:sticky sm:top-0 sm:z-20">
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
          <h1 className="mr-auto text-xl sm:text-2xl">{caseId ? 'Edit case' : 'New case'}</h1>
          {current && <StatusBadge status={current.status} />}
          <AutosaveStatus state={autosave.state} isNew={caseId === null} />
          <CaseFormActions caseId={caseId} current={current} flush={autosave.flush} />
        </div>
        <div className="mt-2">
          <SectionNav label="Form sections" sections={SECTIONS} />
        </div>
      </div>
      {/* phones: the toolbar scrolls away, so the save state follows in a corner */}
      {autosave.state.kind !== 'clean' && (
        <div aria-hidden className="fixed right-3 bottom-3 z-20 rounded-full border border-rule bg-sheet px-3 py-1 shadow-md sm:hidden">
          <AutosaveStatus state={autosave.state} quiet />
        </div>
      )}
      <RestoreDraftBanner form={form} userId={userId} caseId={initialCase?.id ?? null} serverCase={initialCase} />
      {autosave.state.kind === 'failed' && autosave.state.conflict && (
        <Alert tone="caution" title="Someone else saved this case while you were editing">
          <p>Your edits are kept in this browser. Reload to see the newer version; you will be offered your edits to put back.</p>
          <Button type="button" variant="secondary" className="mt-2" onClick={reloadSaved}>
            Reload the saved version
          </Button>
        </Alert>
      )}
      {current?.status === 'needs_changes' && current.reviewNote && (
        <Alert tone="caution" title="Sent back by the reviewer">
          <p className="whitespace-pre-line">{current.reviewNote}</p>
        </Alert>
      )}
      <SafetyCaution risks={risks} setupReasons={setupReasons} />
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem] xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="flex min-w-0 flex-col gap-5">
          <WhatHappenedSection form={form} />
          <SetupSection form={form} />
          <SignalSection form={form} />
          <AttachmentsSection
            caseId={caseId}
            attachments={current?.attachments ?? []}
            uploads={uploads.items}
            onFiles={uploads.start}
            onDismiss={uploads.dismiss}
            renderCaptureOffer={(capture) => (
              <div className="flex flex-col gap-2">
                <FillSetupFromCapture form={form} capture={capture} />
                <FillObservedFromCapture form={form} capture={capture} />
              </div>
            )}
          />
          <CauseSection form={form} safetyNeeded={risks.length > 0 || setupReasons.length > 0} />
          <LessonSection form={form} />
          <p className="text-sm text-muted">
            Drafts save themselves as you type.{' '}
            {caseId && (
              <Link to={`/cases/${caseId}`} className="underline underline-offset-2">
                See the case page
              </Link>
            )}
          </p>
        </div>
        <aside className="min-w-0 lg:sticky lg:top-28 lg:max-h-[calc(100vh-8rem)] lg:self-start lg:overflow-y-auto">
          <LiveDiagnosisPanel form={form} live={liveDiagnosis} />
        </aside>
      </div>
    </form>
  );
}
