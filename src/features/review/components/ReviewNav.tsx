import { SubNav } from '../../../components/ui/SubNav';

export function ReviewNav() {
  return (
    <SubNav
      label="Review desk"
      items={[
        { to: '/review', label: 'Queue', end: true },
        { to: '/review/tags', label: 'Tags' },
      ]}
    />
  );
}
