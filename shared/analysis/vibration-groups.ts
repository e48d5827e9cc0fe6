import type { PeakLabel } from '../schemas/report';

/**
 * Vibration peaks gathered by their cause, so one chipped prop is one story however many speeds
 * and axes it shows on: the rotor orders of one motor (or of one set of motors order tracking
 * could not tell apart) at every speed and harmonic; one fixed frame mode on every axis; the
 * motors' electrical noise; and any other line by its frequency across axes. The review's peak
 * table and the findings both group with this, so the two always agree.
 */

export interface GroupablePeak {
  channel: string;
  hz: number;
  db: number;
  label: PeakLabel;
  motor?: number;
  /** Motors the order tracking could not tell apart, strongest first. */
  candidates?: number[];
  aliasOfHz?: number;
}

export type CauseKind = 'rotor' | 'frame' | 'electrical' | 'line';

export interface VibrationCause<P extends GroupablePeak = GroupablePeak> {
  /** Stable within a report: `rotor:2`, `rotor:2+4`, `rotor:any`, `frame:290`, `electrical`, `line:412`. */
  key: string;
  kind: CauseKind;
  /** The motor, or the motors it could be (strongest first); empty when unknown. */
  motors: number[];
  /** Loudest first. */
  members: P[];
  /** Channels it shows on, in the order of their loudest member. */
  channels: string[];
  /** Rotor orders among the members (rotor causes only), in order of harmonic. */
  orders: Exclude<PeakLabel, null | 'frame'>[];
  /** Lowest and highest member frequency, Hz. */
  hzRange: [number, number];
}

const ORDER_RANK: Record<Exclude<PeakLabel, null | 'frame'>, number> = {
  'rotor-1x': 1,
  'rotor-2x': 2,
  'blade-pass': 3,
};

/** Two lines are the same when within 3 bins or 3 % of each other (the labelling's tolerance). */
export function sameLine(a: number, b: number, df: number): boolean {
  return Math.abs(a - b) <= Math.max(3 * df, 0.03 * Math.max(a, b));
}

function motorsOf(p: GroupablePeak): number[] {
  if (p.motor !== undefined) return [p.motor];
  return p.candidates?.length ? [...p.candidates] : [];
}

function kindOf(p: GroupablePeak): CauseKind {
  if (p.label === 'frame') return 'frame';
  if (p.label) return 'rotor';
  return p.aliasOfHz !== undefined ? 'electrical' : 'line';
}

/**
 * Groups peaks by cause, loudest cause first (by its loudest member's dB). `df` is the spectra's
 * bin spacing, for telling fixed lines apart.
 */
export function groupPeaks<P extends GroupablePeak>(
  peaks: readonly P[],
  df: number,
): VibrationCause<P>[] {
  const sorted = [...peaks].sort((a, b) => b.db - a.db);
  const groups: { key: string; kind: CauseKind; motors: number[]; members: P[] }[] = [];
  for (const p of sorted) {
    const kind = kindOf(p);
    let g: (typeof groups)[number] | undefined;
    if (kind === 'rotor') {
      const motors = motorsOf(p);
      // A rotor named alone joins the set it was a candidate of (and the other way round): the
      // same rotor, told apart at one speed and not at another.
      g = groups.find(
        (x) =>
          x.kind === 'rotor' &&
          (motors.length === 0
            ? x.motors.length === 0
            : x.motors.length > 0 &&
              (motors.every((m) => x.motors.includes(m)) ||
                x.motors.every((m) => motors.includes(m)))),
      );
      if (g && motors.length && motors.length < g.motors.length) g.motors = motors;
      if (!g) {
        g = {
          key: `rotor:${motors.length ? [...motors].sort((a, b) => a - b).join('+') : 'any'}`,
          kind,
          motors,
          members: [],
        };
        groups.push(g);
      }
    } else if (kind === 'electrical') {
      g = groups.find((x) => x.kind === 'electrical');
      if (!g) groups.push((g = { key: 'electrical', kind, motors: [], members: [] }));
    } else {
      // A fixed line: the same frequency on any axis, judged against the loudest member.
      g = groups.find((x) => x.kind === kind && sameLine(x.members[0]!.hz, p.hz, df));
      if (!g)
        groups.push((g = { key: `${kind}:${Math.round(p.hz)}`, kind, motors: [], members: [] }));
    }
    g.members.push(p);
  }
  return groups.map((g) => {
    const channels: string[] = [];
    for (const m of g.members) if (!channels.includes(m.channel)) channels.push(m.channel);
    const orders = [
      ...new Set(g.members.flatMap((m) => (m.label && m.label !== 'frame' ? [m.label] : []))),
    ].sort((a, b) => ORDER_RANK[a] - ORDER_RANK[b]);
    const hz = g.members.map((m) => m.hz);
    // A set narrowed by a later member keeps the name it has now.
    const key =
      g.kind === 'rotor'
        ? `rotor:${g.motors.length ? [...g.motors].sort((a, b) => a - b).join('+') : 'any'}`
        : g.key;
    return {
      key,
      kind: g.kind,
      motors: g.motors,
      members: g.members,
      channels,
      orders,
      hzRange: [Math.min(...hz), Math.max(...hz)] as [number, number],
    };
  });
}

/**
 * The distinct lines of a cause: members on several axes at the same frequency count once
 * (the loudest), lowest frequency first.
 */
export function distinctLines<P extends GroupablePeak>(cause: VibrationCause<P>, df: number): P[] {
  const out: P[] = [];
  for (const m of cause.members)
    if (!out.some((o) => sameLine(o.hz, m.hz, df) && o.label === m.label)) out.push(m);
  return out.sort((a, b) => a.hz - b.hz);
}
