import { Link, NavLink, useNavigate } from 'react-router';
import type { Me } from '../../shared/auth';
import { Button } from '../../components/ui/button';
import { Logo } from '../../components/ui/logo';
import { useLogout } from '../../features/auth/api/logout';
import { NotificationBell } from '../../features/notifications/components/notification-bell';
import { cn } from '../../lib/cn';
import { paths } from '../../lib/paths';
import { useCanSite } from '../../lib/authorization';

const navLink = ({ isActive }: { isActive: boolean }) =>
  cn(
    'rounded-md px-3 py-1.5 text-sm font-semibold transition-colors',
    isActive ? 'bg-ink-100 text-ink-900' : 'text-ink-700 hover:bg-paper-200',
  );

export function ShellHeader({ me }: { me: Me }) {
  const navigate = useNavigate();
  const canManageUsers = useCanSite('users:manage');
  const logout = useLogout({ onSettled: () => navigate(paths.signIn, { replace: true }) });

  return (
    <header className="border-b border-paper-300 bg-paper-50/80">
      <div className="mx-auto flex max-w-5xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link to={paths.projects} aria-label="Beadloom home" className="rounded-md">
          <Logo />
        </Link>
        <nav aria-label="Main" className="flex flex-1 gap-1">
          <NavLink to={paths.projects} className={navLink}>
            Projects
          </NavLink>
          {canManageUsers && (
            <NavLink to={paths.adminUsers} className={navLink}>
              Users
            </NavLink>
          )}
        </nav>
        <div className="flex items-center gap-3">
          <NotificationBell />
          <NavLink to={paths.account} className={navLink} aria-label={`Your account (${me.displayName})`}>
            <span className="inline-flex items-center gap-2">
              <span aria-hidden="true" className="grid size-6 place-items-center rounded-full bg-ink-700 text-xs text-paper-50">
                {initials(me.displayName || me.email)}
              </span>
              {me.displayName}
            </span>
          </NavLink>
          <Button variant="secondary" size="sm" pending={logout.isPending} pendingText="Signing out…" onClick={() => logout.mutate()}>
            Sign out
          </Button>
        </div>
      </div>
    </header>
  );
}

function initials(name: string): string {
  // First and last word, leaving out anything in brackets: "Ada Quill (site admin)" → "AQ".
  const words = name.replace(/\(.*?\)/g, ' ').trim().split(/\s+/).filter(Boolean);
  const first = words[0]?.[0] ?? '?';
  const last = words.length > 1 ? (words.at(-1)?.[0] ?? '') : '';
  return (first + last).toUpperCase();
}
