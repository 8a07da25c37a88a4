import { DiagnosePage } from '../../features/diagnosis/components/DiagnosePage';

export const DiagnoseRoute = DiagnosePage;
