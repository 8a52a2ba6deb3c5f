import type { Role } from '../../../shared/auth/roles';

export type NavItem = { to: string; label: string; roles: Role[] };

/** The office screens each role reaches from the top bar. */
export const navItems: NavItem[] = [
  { to: '/today', label: 'Today', roles: ['therapist', 'supervisor'] },
  { to: '/athletes', label: 'Athletes', roles: ['therapist', 'supervisor'] },
  { to: '/review', label: 'Review desk', roles: ['supervisor', 'admin'] },
  { to: '/staff', label: 'Staff', roles: ['admin'] },
];
