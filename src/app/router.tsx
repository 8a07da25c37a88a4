import { lazy, Suspense, type ComponentType } from 'react';
import { useRoutes, type RouteObject } from 'react-router-dom';
import type { Role } from '../../shared/auth/roles';
import { Loading } from '../components/ui/Panel';
import { RequireAuth } from '../features/auth/components/RequireAuth';
import { SignInPage } from '../features/auth/components/SignInPage';
import { AppShell } from './AppShell';
import { NotFoundRoute } from './routes/not-built';

const RELOADED = 'ft.reloaded-for-new-build';

/** A screen's code, fetched when first opened; after a new build its old file is gone, so reload once. */
async function loadScreen<M>(load: () => Promise<M>): Promise<M> {
  try {
    const m = await load();
    sessionStorage.removeItem(RELOADED);
    return m;
  } catch (err) {
    if (sessionStorage.getItem(RELOADED)) throw err;
    sessionStorage.setItem(RELOADED, '1');
    window.location.reload();
    return new Promise<M>(() => {});
  }
}

// only sign-in comes with the app (issue 15: the sign-in route loads no code it does not use);
// every other screen, the Bench included, is fetched when first opened
const screen = <M,>(load: () => Promise<M>, pick: (m: M) => ComponentType) => lazy(() => loadScreen(load).then((m) => ({ default: pick(m) })));
const BenchRoute = screen(() => import('./routes/bench'), (m) => m.BenchRoute);
const ProfilePage = screen(() => import('../features/auth/components/ProfilePage'), (m) => m.ProfilePage);
const ResetRequestPage = screen(() => import('../features/auth/components/ResetRequestPage'), (m) => m.ResetRequestPage);
const ResetConfirmPage = screen(() => import('../features/auth/components/ResetConfirmPage'), (m) => m.ResetConfirmPage);
const AcceptInvitationPage = screen(() => import('../features/auth/components/AcceptInvitationPage'), (m) => m.AcceptInvitationPage);
const cases = () => import('./routes/cases');
const CasesRoute = screen(cases, (m) => m.CasesRoute);
const CaseRoute = screen(cases, (m) => m.CaseRoute);
// one component for /cases/new and /cases/:id/edit, so a new case's editor survives its own creation
const CaseEditorRoute = screen(cases, (m) => m.CaseEditorRoute);
const DiagnoseRoute = screen(() => import('./routes/diagnose'), (m) => m.DiagnoseRoute);
const LessonsRoute = screen(() => import('./routes/lessons'), (m) => m.LessonsRoute);
const HelpIndexRoute = screen(() => import('./routes/help'), (m) => m.HelpIndexRoute);
const HelpTopicRoute = screen(() => import('./routes/help'), (m) => m.HelpTopicRoute);
const PeopleRoute = screen(() => import('./routes/admin'), (m) => m.PeopleRoute);
const OutboxRoute = screen(() => import('./routes/admin'), (m) => m.OutboxRoute);
const ChecklistPrintPage = screen(() => import('../features/lessons/components/ChecklistPrintPage'), (m) => m.ChecklistPrintPage);
const ReviewDeskPage = screen(() => import('../features/review/components/ReviewDeskPage'), (m) => m.ReviewDeskPage);
const TagCurationPage = screen(() => import('../features/review/components/TagCurationPage'), (m) => m.TagCurationPage);

const open = (element: React.ReactNode) => <Suspense fallback={<Loading />}>{element}</Suspense>;

const guarded = (element: React.ReactNode, role?: Role) => (
  <RequireAuth role={role}>
    <Suspense fallback={<Loading />}>{element}</Suspense>
  </RequireAuth>
);

export const routes: RouteObject[] = [
  // a sheet of paper to print: outside the shell, so no navigation chrome
  { path: '/lessons/checklist', element: guarded(<ChecklistPrintPage />) },
  {
    element: <AppShell />,
    children: [
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/reset-password', element: open(<ResetRequestPage />) },
      { path: '/reset-password/:token', element: open(<ResetConfirmPage />) },
      { path: '/accept-invitation/:token', element: open(<AcceptInvitationPage />) },
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

/**
 * The routes in declarative mode (BrowserRouter + useRoutes): the app uses no loaders, actions
 * or blockers, and leaving the data router out keeps its code off the sign-in page.
 */
export function AppRoutes() {
  return useRoutes(routes);
}
