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
import { NotBuiltRoute, NotFoundRoute } from './routes/not-built';
import { OutboxRoute, PeopleRoute } from './routes/admin';

const guarded = (element: React.ReactNode, role?: Role) => <RequireAuth role={role}>{element}</RequireAuth>;

const notBuilt = (title: string, what: string, role?: Role) => guarded(<NotBuiltRoute title={title} what={what} />, role);

export const routes: RouteObject[] = [
  {
    element: <AppShell />,
    children: [
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/reset-password', element: <ResetRequestPage /> },
      { path: '/reset-password/:token', element: <ResetConfirmPage /> },
      { path: '/accept-invitation/:token', element: <AcceptInvitationPage /> },
      { path: '/', element: guarded(<BenchRoute />) },
      { path: '/profile', element: guarded(<ProfilePage />) },
      { path: '/cases', element: notBuilt('Cases', 'The sortable, filterable table of every case you may see arrives with the case write-ups.') },
      { path: '/cases/new', element: notBuilt('New case', 'The structured incident form arrives with the case write-ups.') },
      { path: '/cases/:id', element: notBuilt('Case', 'The case page arrives with the case write-ups.') },
      { path: '/cases/:id/edit', element: notBuilt('Edit case', 'Editing arrives with the case write-ups.') },
      { path: '/diagnose', element: notBuilt('Diagnose', 'The diagnosis engine on its own — setup and observation in, ranked causes out — arrives with the engine.') },
      { path: '/lessons', element: notBuilt('Lessons', 'Verified lessons grouped by cause and the printable bench checklist arrive with moderation.') },
      { path: '/review', element: notBuilt('Review desk', 'The queue of cases waiting for verification arrives with moderation.', 'moderator') },
      { path: '/admin/people', element: guarded(<PeopleRoute />, 'admin') },
      { path: '/dev/outbox', element: guarded(<OutboxRoute />, 'admin') },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
];

export const createRouter = () => createBrowserRouter(routes);
