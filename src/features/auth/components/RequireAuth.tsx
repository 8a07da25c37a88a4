import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { hasRole, ROLE_LABELS, type Role } from '../../../../shared/auth/roles';
import { Loading, Panel } from '../../../components/ui/Panel';
import { useMe } from '../api/get-me';

/** Sends signed-out visitors to sign-in and back; shows a refusal when the role is too low. */
export function RequireAuth({ role, children }: { role?: Role; children: ReactNode }) {
  const { user, isPending } = useMe();
  const location = useLocation();
  if (isPending) return <Loading />;
  if (!user) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname + location.search)}`} replace />;
  if (role && !hasRole(user, role)) {
    return (
      <Panel title="Not for your role">
        <p className="text-muted">
          This page is for {ROLE_LABELS[role].toLowerCase()}s; you are signed in as {ROLE_LABELS[user.role].toLowerCase()}. Ask an admin if
          you need it.
        </p>
      </Panel>
    );
  }
  return <>{children}</>;
}
