import { useCallback, useSyncExternalStore } from 'react';
import type { Me } from '../../../shared/schemas/auth';
import { useMe } from '../../api/session';

const KEY = 'hoverprint.active-team';
const listeners = new Set<() => void>();

function read(): string | null {
  try {
    return localStorage.getItem(KEY);
  } catch {
    return null;
  }
}

export function setActiveTeamId(teamId: string) {
  try {
    localStorage.setItem(KEY, teamId);
  } catch {
    // private mode: the choice lasts for this page only
  }
  memory = teamId;
  listeners.forEach((l) => l());
}

let memory: string | null = null;
const snapshot = () => read() ?? memory;
function subscribe(listener: () => void) {
  listeners.add(listener);
  const onStorage = (e: StorageEvent) => e.key === KEY && listener();
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
}

export type ActiveTeam = Me['teams'][number];

/** The chosen team if the user is still in it, else their first team. */
export function pickTeam(me: Me | null | undefined, chosen: string | null): ActiveTeam | undefined {
  if (!me) return undefined;
  return me.teams.find((t) => t.id === chosen) ?? me.teams[0];
}

/** The team the fleet, team page and new imports work in; the user switches it in the header. */
export function useActiveTeam() {
  const me = useMe().data;
  const chosen = useSyncExternalStore(subscribe, snapshot, () => null);
  const team = pickTeam(me, chosen);
  const select = useCallback((teamId: string) => setActiveTeamId(teamId), []);
  return { team, teams: me?.teams ?? [], select };
}
