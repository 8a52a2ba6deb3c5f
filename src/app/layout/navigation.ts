import type { Role } from '../../../shared/auth/roles';

export type NavItem = { to: string; label: string; roles: Role[] };

/** The office screens each role reaches from the top bar. */
export const navItems: NavItem[] = [
  { to: '/today', label: 'Today', roles: ['therapist', 'supervisor'] },
  { to: '/athletes', label: 'Athletes', roles: ['therapist', 'supervisor'] },
  { to: '/review', label: 'Review desk', roles: ['supervisor', 'admin'] },
  { to: '/sequences', label: 'Sequences', roles: ['supervisor'] },
  { to: '/staff', label: 'Staff', roles: ['admin'] },
  { to: '/settings', label: 'Settings', roles: ['admin'] },
  { to: '/audit', label: 'Audit', roles: ['admin', 'supervisor'] },
  { to: '/data-rights', label: 'Data rights', roles: ['admin'] },
  // The local mailbox: outside production only (in production /api/mailbox answers 404 and the page says so).
  { to: '/mailbox', label: 'Mailbox', roles: ['admin'] },
];
