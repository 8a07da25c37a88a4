import { canModerate } from '../../../shared/auth/roles';
import { useMe } from '../../features/auth/api/get-me';
import { LessonsPage } from '../../features/lessons/components/LessonsPage';

export function LessonsRoute() {
  const { user } = useMe();
  return <LessonsPage canPin={canModerate(user)} />;
}
