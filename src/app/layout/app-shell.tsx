import type { ReactNode } from 'react';
import { NavLink, useNavigate } from 'react-router-dom';
import { useQuery } from '@tanstack/react-query';
import { LogOut } from 'lucide-react';
import type { SessionUser } from '../../../shared/auth/schemas';
import { useSignOut } from '../../features/auth/api/sign-out';
import { apiRequest } from '../../lib/api-client';
import { navItems } from './navigation';

const roleWord = { therapist: 'Therapist', supervisor: 'Supervisor', admin: 'Admin' } as const;

/** Whether this server keeps a local mailbox (never in production). */
function useHasLocalMailbox(enabled: boolean) {
  return useQuery({
    queryKey: ['health'],
    queryFn: () => apiRequest<{ ok: boolean; mailbox?: boolean }>('/api/health'),
    staleTime: Infinity,
    enabled,
  }).data?.mailbox === true;
}

/**
 * The office screens' frame: who is signed in on the first line, the screens of their role on the second,
 * so the menu never wraps however many screens a role has.
 */
export function AppShell({ user, children }: { user: SessionUser; children: ReactNode }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  const hasMailbox = useHasLocalMailbox(user.role === 'admin');
  const items = navItems.filter((item) => item.roles.includes(user.role) && (item.to !== '/mailbox' || hasMailbox));

  return (
    <div className="min-h-screen bg-paper text-ink">
      <header className="border-b border-ink/15 bg-paper-raised">
        <div className="mx-auto flex max-w-6xl items-center justify-between gap-4 px-4 pt-2">
          <span className="text-xl font-bold tracking-tight">Mendstep</span>
          <div className="flex items-center gap-3 text-sm">
            <span>
              <span className="font-semibold" data-testid="signed-in-user">{user.name}</span>
              <span className="text-ink-muted"> · {roleWord[user.role]}</span>
              {user.clinicName ? <span className="text-ink-muted"> · {user.clinicName}</span> : null}
            </span>
            <button
              type="button"
              className="inline-flex min-h-target items-center gap-2 rounded-lg px-3 hover:bg-paper-sunk"
              onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in', { replace: true }) })}
            >
              <LogOut aria-hidden className="h-4 w-4" /> Sign out
            </button>
          </div>
        </div>
        <nav aria-label="Main" className="mx-auto flex max-w-6xl gap-1 overflow-x-auto px-4 pb-2 pt-1">
          {items.map((item) => (
            <NavLink
              key={item.to}
              to={item.to}
              className={({ isActive }) =>
                `inline-flex min-h-target shrink-0 items-center rounded-lg px-3 font-medium ${isActive ? 'bg-ink text-paper' : 'hover:bg-paper-sunk'}`
              }
            >
              {item.label}
            </NavLink>
          ))}
        </nav>
      </header>
      <main className="mx-auto max-w-6xl px-4 py-6">{children}</main>
      <footer className="mx-auto max-w-6xl px-4 pb-6 text-xs text-ink-muted">
        Mendstep supports, and does not replace, your clinical judgement, a physician's advice and your local regulations and scope of practice.
      </footer>
    </div>
  );
}
