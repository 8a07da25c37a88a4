import { useParams } from 'react-router-dom';
import { HelpIndexPage } from '../../features/help/components/HelpIndexPage';
import { HelpTopicPage } from '../../features/help/components/HelpTopicPage';

export const HelpIndexRoute = HelpIndexPage;

export function HelpTopicRoute() {
  const { topic } = useParams();
  return <HelpTopicPage slug={topic} />;
}
