import { NavLink, Outlet } from 'react-router-dom';
import { ServerStatus } from '../../features/status/components/server-status';

const nav = [
  { to: '/', label: 'Fleet', end: true },
  { to: '/import', label: 'Import', end: false },
  { to: '/team', label: 'Team', end: false },
];

export function AppLayout() {
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-line bg-paper-raised">
        <div className="mx-auto flex max-w-6xl items-center gap-8 px-4 py-3">
          <span className="flex items-center gap-2 font-semibold tracking-tight text-slate-brand">
            <img src="/favicon.svg" alt="" className="h-6 w-6" />
            Hoverprint
          </span>
          <nav aria-label="Main" className="flex gap-1 text-sm">
            {nav.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                end={item.end}
                className={({ isActive }) =>
                  'rounded px-3 py-1.5 ' +
                  (isActive ? 'bg-slate-brand text-paper' : 'text-ink-soft hover:bg-paper-sunk')
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto">
            <ServerStatus />
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-4 py-6">
        <Outlet />
      </main>
      <footer className="border-t border-line px-4 py-3 text-center text-xs text-ink-faint">
        Findings are advice from the log, not an airworthiness sign-off. Bench work with props off;
        charge and store LiPo packs as their maker says; fly by your local rules.
      </footer>
    </div>
  );
}
