import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { NavLink, Outlet } from 'react-router-dom';
import { useDevMailAvailable } from '../../api/mail';
import { useActiveTeam } from '../../features/session/active-team';
import { sessionKeys, useMe } from '../../api/session';
import { AccountMenu } from '../../features/session/components/account-menu';
import { TeamSwitcher } from '../../features/session/components/team-switcher';
import { ServerStatus } from '../../features/status/components/server-status';
import { SyncIndicator } from '../../features/sync/components/sync-indicator';
import { LocalStoreNote } from '../../features/sync/components/local-store-note';
import type { SyncPassResult } from '../../features/sync/sync-runner';
import { useSyncDriver } from '../../features/sync/use-sync';
import { refreshAfterSync } from '../../api/flights';

const nav = [
  { to: '/', label: 'Fleet', end: true },
  { to: '/import', label: 'Import', end: false },
  { to: '/team', label: 'Team', end: false },
];

const linkClass = ({ isActive }: { isActive: boolean }) =>
  'rounded px-3 py-1.5 ' +
  (isActive ? 'bg-slate-brand text-paper' : 'text-ink-soft hover:bg-paper-sunk');

export function AppLayout() {
  const me = useMe().data;
  const { team } = useActiveTeam();
  const queryClient = useQueryClient();
  const hasInbox = useDevMailAvailable();
  const onPass = useCallback(
    (result: SyncPassResult) => {
      // The session ended elsewhere (expired, password changed): let the header find out.
      if (result.stoppedBy === 'signed-out')
        void queryClient.invalidateQueries({ queryKey: sessionKeys.me() });
      if (result.flightsSynced > 0) void refreshAfterSync(queryClient);
    },
    [queryClient],
  );
  useSyncDriver({ signedIn: Boolean(me), teamId: team?.id, onPass });

  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-line bg-paper-raised">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2.5">
          <span className="flex items-center gap-2 font-semibold tracking-tight text-slate-brand">
            <img src="/favicon.svg" alt="" className="h-6 w-6" />
            Hoverprint
          </span>
          <nav aria-label="Main" className="flex gap-1 text-sm">
            {nav.map((item) => (
              <NavLink key={item.to} to={item.to} end={item.end} className={linkClass}>
                {item.label}
              </NavLink>
            ))}
            {hasInbox && (
              <NavLink to="/dev/mail" className={linkClass}>
                Inbox
              </NavLink>
            )}
          </nav>
          {me && <TeamSwitcher />}
          <div className="ml-auto flex items-center gap-4">
            <SyncIndicator />
            <ServerStatus />
            <AccountMenu />
          </div>
        </div>
      </header>
      <LocalStoreNote />
      <main className="mx-auto w-full max-w-6xl flex-1 px-4 py-6">
        <Outlet />
      </main>
      <footer className="border-t border-line px-4 py-3 text-center text-xs text-ink-faint">
        Findings are advice read from the log, not an airworthiness sign-off. Bench work with props
        off; charge and store LiPo packs as their maker says; keep ESC current within its rating;
        fly by your local rules and licensed practice.
      </footer>
    </div>
  );
}
