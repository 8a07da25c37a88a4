import { useMe } from '../../features/auth/api/get-me';
import { CasebookTransferPanel } from '../../features/casebook/components/CasebookTransferPanel';
import { OutboxPage } from '../../features/outbox/components/OutboxPage';
import { PeoplePage } from '../../features/people/components/PeoplePage';

export function PeopleRoute() {
  const { user } = useMe();
  return user ? (
    <>
      <PeoplePage selfId={user.id} />
      <CasebookTransferPanel />
    </>
  ) : null;
}

export const OutboxRoute = OutboxPage;
