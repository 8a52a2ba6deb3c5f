import type { ReactNode } from 'react';
import { NavLink, useNavigate } from 'react-router-dom';
import { LogOut } from 'lucide-react';
import type { SessionUser } from '../../../shared/auth/schemas';
import { useSignOut } from '../../features/auth/api/sign-out';
import { navItems } from './navigation';

const roleWord = { therapist: 'Therapist', supervisor: 'Supervisor', admin: 'Admin' } as const;

export function AppShell({ user, children }: { user: SessionUser; children: ReactNode }) {
  const signOut = useSignOut();
  const navigate = useNavigate();
  const items = navItems.filter((item) => item.roles.includes(user.role));

  return (
    <div className="min-h-screen bg-paper text-ink">
      <header className="border-b border-ink/15 bg-paper-raised">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
          <span className="text-xl font-bold tracking-tight">Mendstep</span>
          <nav aria-label="Main" className="flex flex-1 flex-wrap gap-1">
            {items.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                className={({ isActive }) =>
                  `inline-flex min-h-target items-center rounded-lg px-3 font-medium ${isActive ? 'bg-ink text-paper' : 'hover:bg-paper-sunk'}`
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="flex items-center gap-3 text-sm">
            <span>
              <span className="font-semibold" data-testid="signed-in-user">{user.name}</span>
              <span className="text-ink-muted"> · {roleWord[user.role]}</span>
              {/* The clinic's name only where there is room: the menu must stay on one line on a tablet. */}
              {user.clinicName ? <span className="hidden text-ink-muted xl:inline"> · {user.clinicName}</span> : null}
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
      </header>
      <main className="mx-auto max-w-6xl px-4 py-6">{children}</main>
      <footer className="mx-auto max-w-6xl px-4 pb-6 text-xs text-ink-muted">
        Mendstep supports, and does not replace, your clinical judgement, a physician's advice and your local regulations and scope of practice.
      </footer>
    </div>
  );
}
