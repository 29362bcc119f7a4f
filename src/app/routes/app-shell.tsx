import { NavLink, Navigate, Outlet, useLocation, useNavigate } from 'react-router-dom';
import { useSignOut } from '@/features/auth/api/sign-out';
import { HelpPanel } from '@/features/help/components/help-panel';
import { HelpProvider, useHelp } from '@/features/help/help-context';
import { navFor } from '../nav';
import { useAgency } from '../use-agency';
import { NotFoundPage } from './not-found';

export function AppShell() {
  const { agencyId, membership, me, loading } = useAgency();
  const location = useLocation();
  const navigate = useNavigate();
  const signOut = useSignOut();
  if (loading) return <div className="p-8 text-sm text-asphalt-muted">Loading…</div>;
  if (!me) return <Navigate to={`/sign-in?next=${encodeURIComponent(location.pathname)}`} replace />;
  if (!membership) return <NotFoundPage />;
  const items = navFor(membership.role, me.mailCatcher);
  const section = location.pathname.split('/')[3] ?? 'network';
  const allowed = items.some((i) => i.to === section);
  const link = ({ isActive }: { isActive: boolean }) =>
    `block rounded px-3 py-1.5 text-sm ${isActive ? 'bg-white/10 font-bold text-white' : 'text-white/75 hover:bg-white/5 hover:text-white'}`;
  return (
    <HelpProvider>
      <div className="flex min-h-screen">
        {/* The dark column runs the page's full height; the rail inside it stays in view as the page scrolls. */}
        <div className="no-print w-56 shrink-0 bg-asphalt">
          <aside
            className="sticky top-0 flex h-screen w-56 flex-col overflow-y-auto bg-asphalt text-white"
            aria-label="Main navigation"
          >
            <div className="px-4 pb-3 pt-4">
              <div className="text-lg font-black tracking-tight">Wearcourse</div>
              {me.memberships.length > 1 ? (
                <select
                  aria-label="Agency"
                  className="mt-2 w-full rounded bg-asphalt-soft px-2 py-1 text-sm text-white"
                  value={agencyId}
                  onChange={(e) => navigate(`/a/${e.target.value}/network`)}
                >
                  {me.memberships.map((m) => (
                    <option key={m.agencyId} value={m.agencyId}>
                      {m.agencyName}
                    </option>
                  ))}
                </select>
              ) : (
                <div className="mt-1 text-sm text-white/80">{membership.agencyName}</div>
              )}
              <div className="mt-1 text-xs uppercase tracking-wide text-white/50" data-testid="role">
                {membership.role}
              </div>
            </div>
            <nav className="flex flex-1 flex-col gap-0.5 px-2" data-testid="nav">
              {items
                .filter((i) => i.group === 'work')
                .map((i) => (
                  <NavLink key={i.to} to={i.to} className={link}>
                    {i.label}
                  </NavLink>
                ))}
              <div className="mt-auto" />
              <HelpButton />
              {items
                .filter((i) => i.group === 'admin')
                .map((i) => (
                  <NavLink key={i.to} to={i.to} className={link}>
                    {i.label}
                  </NavLink>
                ))}
            </nav>
            <div className="border-t border-white/10 px-4 py-3 text-xs text-white/70">
              <div className="truncate" title={me.user.email}>
                {me.user.name}
              </div>
              <button
                type="button"
                className="mt-1 text-white underline-offset-2 hover:underline"
                onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in') })}
              >
                Sign out
              </button>
            </div>
          </aside>
        </div>
        <main className="min-w-0 flex-1 px-8 py-6 print:p-0">{allowed ? <Outlet /> : <NotFoundPage inline />}</main>
      </div>
      <HelpPanel />
    </HelpProvider>
  );
}

/** The rail's way into the glossary, on every screen. */
function HelpButton() {
  const help = useHelp();
  return (
    <button
      type="button"
      className="block w-full rounded px-3 py-1.5 text-left text-sm text-white/75 hover:bg-white/5 hover:text-white"
      onClick={() => (help?.open ? help.close() : help?.show())}
      aria-expanded={help?.open ?? false}
    >
      Help &amp; glossary
    </button>
  );
}
