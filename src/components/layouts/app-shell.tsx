import { NavLink, Outlet } from 'react-router-dom';
import { ButtonLink } from '@/components/ui/button';
import { WaitingWrites } from '@/components/layouts/waiting-writes';
import { signOut, useCheckedPerson } from '@/lib/auth';
import { may, type Action } from '@shared/permissions';
import { ROLE_LABELS } from '@shared/schemas/role-names';

/** A page with an action is offered to those the permission table lets do it; the rest to everyone signed in. */
const NAV: { to: string; label: string; action?: Action }[] = [
  { to: '/shift', label: 'My shift', action: 'joints.record' },
  { to: '/lines', label: 'Line register' },
  { to: '/work-orders', label: 'Work orders', action: 'workOrders.read' },
  { to: '/schedule', label: 'Schedule', action: 'workOrders.read' },
  { to: '/release', label: 'Release', action: 'workOrders.read' },
  { to: '/imports/new', label: 'Import lines', action: 'lines.import' },
  { to: '/calculator', label: 'Joint calculator' },
  { to: '/admin/people', label: 'People & roles', action: 'people.manage' },
  { to: '/admin/plant', label: 'Plant settings', action: 'plantSettings.edit' },
];

/**
 * Drawn at once, before the sign-in check answers: the person's name, their role-bound pages and
 * actions fill in when it has (the page itself opens only after its loader has checked the sign-in).
 */
export function AppShell() {
  const me = useCheckedPerson();
  const items = NAV.filter((n) => !n.action || may(me, n.action));
  return (
    <div className="min-h-screen">
      <header className="sticky top-0 z-20 border-b border-ink/10 bg-ink text-paper">
        <div className="mx-auto flex max-w-[1400px] items-center gap-6 px-4 py-2">
          <span className="flex items-center gap-2 text-lg font-bold tracking-tight">
            <svg aria-hidden width="22" height="22" viewBox="0 0 24 24" className="text-tide-light">
              <path d="M2 9h7v6H2zM15 9h7v6h-7zM9 11h6v2H9z" fill="currentColor" />
            </svg>
            Linewright
          </span>
          <nav aria-label="Main" className="flex flex-1 gap-1 overflow-x-auto">
            {items.map((n) => (
              <NavLink
                key={n.to}
                to={n.to}
                className={({ isActive }) =>
                  `whitespace-nowrap rounded-md px-3 py-2.5 text-sm font-medium ${isActive ? 'bg-paper text-ink' : 'text-paper/80 hover:bg-white/10'}`
                }
              >
                {n.label}
              </NavLink>
            ))}
          </nav>
          {may(me, 'workOrders.plan') && (
            // Below xl the pages' own "New work order" buttons stand in, so the navigation keeps its room.
            <span className="hidden xl:block">
              <ButtonLink to="/work-orders/new" className="whitespace-nowrap">
                New work order
              </ButtonLink>
            </span>
          )}
          <WaitingWrites />
          {me && (
            <div className="flex items-center gap-3 text-sm">
              <span className="hidden text-right leading-tight md:block">
                <span className="block font-semibold">{me.name}</span>
                <span className="block text-paper/70">{me.roles.map((r) => ROLE_LABELS[r]).join(', ') || 'No role yet'}</span>
              </span>
              <button onClick={() => void signOut()} className="rounded-md border border-paper/30 px-3 py-2 hover:bg-white/10">
                Sign out
              </button>
            </div>
          )}
        </div>
      </header>
      <main className="mx-auto max-w-[1400px] px-4 py-6">
        <Outlet />
      </main>
    </div>
  );
}
