/**
 * CPU time of the processes a benchmark starts, read from /proc (Linux only; null elsewhere),
 * so a figure can say where a request's cost lands: the server, the database, or the load
 * generator. On a shared 2-core machine these sum to what the machine can give.
 */
import { readdirSync, readFileSync } from 'node:fs';

/** /proc/<pid>/stat counts in clock ticks of USER_HZ, 100 per second on Linux (man 5 proc). */
const TICK_MS = 10;

interface Stat {
  ppid: number;
  /** utime + stime, and cutime + cstime of children already reaped. */
  ownTicks: number;
  reapedTicks: number;
}

function stat(pid: number): Stat | null {
  try {
    const text = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // The command name may hold spaces; the fields after its closing parenthesis do not.
    const f = text.slice(text.lastIndexOf(')') + 2).split(' ');
    return {
      ppid: Number(f[1]),
      ownTicks: Number(f[11]) + Number(f[12]),
      reapedTicks: Number(f[13]) + Number(f[14]),
    };
  } catch {
    return null;
  }
}

/** CPU milliseconds a process has used so far, or null when /proc cannot tell. */
export function processCpuMs(pid: number): number | null {
  const s = stat(pid);
  return s ? s.ownTicks * TICK_MS : null;
}

/**
 * CPU milliseconds of a process and its live children plus those it has reaped: for
 * PostgreSQL the postmaster, its backends and its helper processes.
 */
export function processTreeCpuMs(rootPid: number): number | null {
  const root = stat(rootPid);
  if (!root) return null;
  let ticks = root.ownTicks + root.reapedTicks;
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    const s = stat(Number(entry));
    if (s?.ppid === rootPid) ticks += s.ownTicks;
  }
  return ticks * TICK_MS;
}
