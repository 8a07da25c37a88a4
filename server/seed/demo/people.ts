import { DEMO_ACCOUNTS } from '../demo-users';
import type { DemoPerson } from './types';

/**
 * The invented team behind the demo casebook: Quillfen Instruments, a small electronics company
 * (fictional, as are its products and people) that builds the Larkspan LS-48 motor drive, the
 * Skerrynode SN-2 battery sensor node, the Pellbright PB-300 mains LED driver, the Cindervale
 * CV-12 battery monitor and the Wrenmoor WM-7 audio interface. The first three people are the
 * demo accounts of DESIGN.md; their e-mails must not change.
 */
const account = (role: DemoPerson['role'], job: string, joinedAt: string): DemoPerson => {
  const a = DEMO_ACCOUNTS.find((x) => x.role === role)!;
  return { handle: role, email: a.email, name: a.name, role, job, joinedAt };
};

export const DEMO_PEOPLE: DemoPerson[] = [
  account('engineer', 'hardware design, Skerrynode SN-2', '2026-04-14T08:30:00.000Z'),
  account('moderator', 'principal analog engineer', '2026-04-14T08:10:00.000Z'),
  account('admin', 'lab manager, test bay 3', '2026-04-14T08:00:00.000Z'),
  { handle: 'mateo.brennan', email: 'mateo.brennan@falsetrace.test', name: 'Mateo Brennan', role: 'engineer', job: 'power electronics, Larkspan LS-48', joinedAt: '2026-04-20T09:00:00.000Z' },
  { handle: 'aoife.renner', email: 'aoife.renner@falsetrace.test', name: 'Aoife Renner', role: 'engineer', job: 'test and validation', joinedAt: '2026-04-21T09:00:00.000Z' },
  { handle: 'kwabena.osei', email: 'kwabena.osei@falsetrace.test', name: 'Kwabena Osei', role: 'engineer', job: 'field service', joinedAt: '2026-04-28T09:00:00.000Z' },
  { handle: 'sunniva.dahl', email: 'sunniva.dahl@falsetrace.test', name: 'Sunniva Dahl-Moreno', role: 'engineer', job: 'graduate engineer, Cindervale CV-12', joinedAt: '2026-05-04T09:00:00.000Z' },
  { handle: 'oskar.nwachukwu', email: 'oskar.nwachukwu@falsetrace.test', name: 'Oskar Nwachukwu', role: 'engineer', job: 'firmware, Wrenmoor WM-7', joinedAt: '2026-05-11T09:00:00.000Z' },
  { handle: 'rhys.tanaka', email: 'rhys.tanaka@falsetrace.test', name: 'Rhys Tanaka', role: 'moderator', job: 'senior power engineer', joinedAt: '2026-04-16T09:00:00.000Z' },
  { handle: 'lucia.varga', email: 'lucia.varga@falsetrace.test', name: 'Lucía Varga', role: 'moderator', job: 'signal-integrity lead', joinedAt: '2026-04-17T09:00:00.000Z' },
];
