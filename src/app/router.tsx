import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import type { Role } from '../../shared/auth/roles';
import { AcceptInvitationPage } from '../features/auth/components/AcceptInvitationPage';
import { ProfilePage } from '../features/auth/components/ProfilePage';
import { RequireAuth } from '../features/auth/components/RequireAuth';
import { ResetConfirmPage } from '../features/auth/components/ResetConfirmPage';
import { ResetRequestPage } from '../features/auth/components/ResetRequestPage';
import { SignInPage } from '../features/auth/components/SignInPage';
import { AppShell } from './AppShell';
import { BenchRoute } from './routes/bench';
import { DiagnoseRoute } from './routes/diagnose';
import { CaseEditorRoute, CaseRoute, CasesRoute } from './routes/cases';
import { NotFoundRoute } from './routes/not-built';
import { OutboxRoute, PeopleRoute } from './routes/admin';
import { LessonsRoute } from './routes/lessons';
import { HelpIndexRoute, HelpTopicRoute } from './routes/help';
import { ChecklistPrintPage } from '../features/lessons/components/ChecklistPrintPage';
import { ReviewDeskPage } from '../features/review/components/ReviewDeskPage';
import { TagCurationPage } from '../features/review/components/TagCurationPage';

const guarded = (element: React.ReactNode, role?: Role) => <RequireAuth role={role}>{element}</RequireAuth>;

export const routes: RouteObject[] = [
  // a sheet of paper to print: outside the shell, so no navigation chrome
  { path: '/lessons/checklist', element: guarded(<ChecklistPrintPage />) },
  {
    element: <AppShell />,
    children: [
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/reset-password', element: <ResetRequestPage /> },
      { path: '/reset-password/:token', element: <ResetConfirmPage /> },
      { path: '/accept-invitation/:token', element: <AcceptInvitationPage /> },
      { path: '/', element: guarded(<BenchRoute />) },
      { path: '/profile', element: guarded(<ProfilePage />) },
      { path: '/cases', element: guarded(<CasesRoute />) },
      { path: '/cases/new', element: guarded(<CaseEditorRoute />) },
      { path: '/cases/:id', element: guarded(<CaseRoute />) },
      { path: '/cases/:id/edit', element: guarded(<CaseEditorRoute />) },
      { path: '/diagnose', element: guarded(<DiagnoseRoute />) },
      { path: '/lessons', element: guarded(<LessonsRoute />) },
      { path: '/help', element: guarded(<HelpIndexRoute />) },
      { path: '/help/:topic', element: guarded(<HelpTopicRoute />) },
      { path: '/review', element: guarded(<ReviewDeskPage />, 'moderator') },
      { path: '/review/tags', element: guarded(<TagCurationPage />, 'moderator') },
      { path: '/admin/people', element: guarded(<PeopleRoute />, 'admin') },
      { path: '/dev/outbox', element: guarded(<OutboxRoute />, 'admin') },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
];

export const createRouter = () => createBrowserRouter(routes);
