import { CASE_STATUS_LABELS, type CaseStatus } from '../../../../shared/schemas/case';
import { Badge } from '../../../components/ui/Panel';

const TONES: Record<CaseStatus, 'plain' | 'agree' | 'caution'> = {
  draft: 'plain',
  in_review: 'plain',
  needs_changes: 'caution',
  verified: 'agree',
  retired: 'plain',
};

export function StatusBadge({ status }: { status: CaseStatus }) {
  return <Badge tone={TONES[status]}>{CASE_STATUS_LABELS[status]}</Badge>;
}
