import { NavLink, Outlet, useNavigate, useParams } from 'react-router';
import { paths } from '@/config/paths';
import { cn } from '@/lib/cn';
import { useMe } from '@/features/auth/api/get-me';
import { useSignOut } from '@/features/auth/api/sign-out';
import { Brand } from '@/components/layout/brand';
import { Options } from '@/components/ui/options';

const navClass = ({ isActive }: { isActive: boolean }) =>
  cn(
    'rounded-md px-3 py-2 text-sm font-medium',
    isActive ? 'bg-primary-soft text-primary' : 'text-ink-soft hover:text-primary',
  );

/** Signed-in layout: top bar with team switcher, main navigation and the user's menu. */
export function AppShell() {
  const { data: me } = useMe();
  const { teamId } = useParams();
  const navigate = useNavigate();
  const signOut = useSignOut();
  const currentTeam = me?.teams.find((t) => t.id === teamId) ?? me?.teams[0];

  return (
    <div className="min-h-dvh">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <header className="border-b border-line bg-white">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3">
          <Brand />
          {me && me.teams.length > 0 && (
            <label className="flex items-center gap-2 text-sm">
              <span className="sr-only">Team</span>
              <select
                className="h-9 max-w-[12rem] rounded-md border border-line bg-white px-2 text-sm"
                value={currentTeam?.id ?? ''}
                onChange={(e) => navigate(paths.studies.getHref(e.target.value))}
              >
                <Options items={me.teams.map((t) => ({ value: t.id, label: t.name }))} />
              </select>
            </label>
          )}
          <nav aria-label="Main" className="flex items-center gap-1">
            {currentTeam && (
              <>
                <NavLink to={paths.studies.getHref(currentTeam.id)} className={navClass}>
                  Studies
                </NavLink>
                <NavLink to={paths.members.getHref(currentTeam.id)} className={navClass}>
                  Team
                </NavLink>
                {currentTeam.role === 'owner' && (
                  <NavLink to={paths.audit.getHref(currentTeam.id)} className={navClass}>
                    Audit
                  </NavLink>
                )}
              </>
            )}
          </nav>
          <div className="ml-auto flex items-center gap-1">
            <NavLink to={paths.account.getHref()} className={navClass}>
              {me?.name ?? 'Account'}
            </NavLink>
            <button
              type="button"
              className="rounded-md px-3 py-2 text-sm font-medium text-ink-soft hover:text-primary"
              onClick={() =>
                signOut.mutate(undefined, { onSuccess: () => navigate(paths.signIn.getHref()) })
              }
            >
              Sign out
            </button>
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto max-w-7xl px-4 py-6 sm:py-8">
        <Outlet />
      </main>
    </div>
  );
}
