import { hasRole, type Role } from '../../shared/auth/roles';

export interface NavItem {
  to: string;
  label: string;
  role?: Role;
  /** Shown only while mails go to the local fake (no SMTP_URL). */
  localMailOnly?: boolean;
}

export const NAV_ITEMS: NavItem[] = [
  { to: '/', label: 'Bench' },
  { to: '/cases', label: 'Cases' },
  { to: '/diagnose', label: 'Diagnose' },
  { to: '/lessons', label: 'Lessons' },
  { to: '/help', label: 'Help' },
  { to: '/review', label: 'Review desk', role: 'moderator' },
  { to: '/admin/people', label: 'People', role: 'admin' },
  { to: '/dev/outbox', label: 'Outbox', role: 'admin', localMailOnly: true },
];

export const navFor = (role: Role, { localMail }: { localMail: boolean }) =>
  NAV_ITEMS.filter((i) => (!i.role || hasRole({ role }, i.role)) && (!i.localMailOnly || localMail));
