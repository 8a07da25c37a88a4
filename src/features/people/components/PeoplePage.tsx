import { useState } from 'react';
import { ROLE_LABELS, ROLES, type Role } from '../../../../shared/auth/roles';
import type { Person } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/Alert';
import { Button } from '../../../components/ui/Button';
import { Badge, Loading, PageHeader, Panel } from '../../../components/ui/Panel';
import { usePeople } from '../api/list-people';
import { useUpdatePerson } from '../api/update-person';
import { InviteForm } from './InviteForm';

function PersonRow({ person, isSelf, onError }: { person: Person; isSelf: boolean; onError: (m: string) => void }) {
  const update = useUpdatePerson();
  const change = (patch: { role?: Role; active?: boolean }) =>
    update.mutate({ id: person.id, ...patch }, { onError: (e) => onError(`${person.name}: ${e.message}`) });
  return (
    <tr className="border-t border-rule align-middle">
      <td className="py-3 pr-4">
        <div className="font-semibold">{person.name}</div>
        <div className="font-mono text-xs text-muted">{person.email}</div>
      </td>
      <td className="py-3 pr-4">
        <label className="sr-only" htmlFor={`role-${person.id}`}>
          Role of {person.name}
        </label>
        <select
          id={`role-${person.id}`}
          value={person.role}
          disabled={isSelf || update.isPending}
          onChange={(e) => change({ role: e.target.value as Role })}
          className="rounded-md border border-rule bg-sheet px-2 py-1"
        >
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </select>
      </td>
      <td className="py-3 pr-4">{person.active ? <Badge tone="agree">active</Badge> : <Badge tone="caution">deactivated</Badge>}</td>
      <td className="py-3 text-right">
        {!isSelf && (
          <Button variant="secondary" busy={update.isPending} onClick={() => change({ active: !person.active })}>
            {person.active ? 'Deactivate' : 'Reactivate'}
          </Button>
        )}
        {isSelf && <span className="text-xs text-muted">you</span>}
      </td>
    </tr>
  );
}

export function PeoplePage({ selfId }: { selfId: number }) {
  const people = usePeople();
  const [error, setError] = useState('');
  return (
    <>
      <PageHeader title="People" lead="Invite colleagues, set who may moderate, and deactivate accounts that should no longer sign in." />
      <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
        <Panel title="Accounts">
          {error && <Alert tone="caution">{error}</Alert>}
          {people.isPending && <Loading what="Loading people" />}
          {people.isError && <Alert tone="caution">{people.error.message}</Alert>}
          {people.data && (
            <div className="overflow-x-auto">
              <table className="w-full min-w-[32rem] text-left text-sm">
                <thead className="text-xs uppercase tracking-wide text-muted">
                  <tr>
                    <th className="pb-2 font-semibold">Person</th>
                    <th className="pb-2 font-semibold">Role</th>
                    <th className="pb-2 font-semibold">State</th>
                    <th className="pb-2" />
                  </tr>
                </thead>
                <tbody>
                  {people.data.people.map((p) => (
                    <PersonRow key={p.id} person={p} isSelf={p.id === selfId} onError={setError} />
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </Panel>
        <div className="flex flex-col gap-6">
          <Panel title="Invite someone">
            <InviteForm />
          </Panel>
          {people.data && people.data.pendingInvitations.length > 0 && (
            <Panel title="Invitations not yet accepted">
              <ul className="font-mono text-sm">
                {people.data.pendingInvitations.map((e) => (
                  <li key={e}>{e}</li>
                ))}
              </ul>
            </Panel>
          )}
        </div>
      </div>
    </>
  );
}
