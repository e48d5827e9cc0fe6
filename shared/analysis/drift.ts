import type { Drift, Finding, FlightReport } from '../schemas/report';
import type { DriftSample } from '../schemas/baseline';
import type { Thresholds } from '../schemas/thresholds';

/** Earlier flights of the same aircraft, oldest first, and how to name them in the verdict. */
export interface Baseline {
  samples: readonly DriftSample[];
  /** "Kite's last 6 flights, since the motor swap on 2 Dec"; default "this aircraft's last N flights". */
  label?: string;
}

/** What drift compares of one flight, from its report. */
export function driftSample(r: FlightReport): DriftSample {
  return {
    hoverS: r.segments.hoverS,
    deviationPct: r.balance.deviationPct,
    asymmetryPct: r.torqueSplit.asymmetryPct,
    cg: r.cg,
    bandRms: Object.fromEntries(Object.entries(r.vibration).map(([ch, v]) => [ch, v.bandRms])),
    internalResistanceOhm: r.power?.internalResistanceOhm ?? null,
    lagMs: r.tracking
      ? { roll: r.tracking.roll.lagMs, pitch: r.tracking.pitch.lagMs, yaw: r.tracking.yaw.lagMs }
      : null,
  };
}

/** Median of the finite values, NaN for none. */
function median(values: readonly number[]): number {
  const s = values.filter(Number.isFinite).sort((a, b) => a - b);
  if (!s.length) return NaN;
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/**
 * Flight-to-flight spread: the median absolute deviation scaled by 1.4826, which equals the
 * standard deviation for normally distributed values (Rousseeuw & Croux 1993; from memory) and
 * shrugs off one odd flight.
 */
function spread(values: readonly number[]): number {
  const m = median(values);
  return 1.4826 * median(values.map((v) => Math.abs(v - m)));
}

const round = (v: number, d = 2) => Math.round(v * 10 ** d) / 10 ** d;
const num = (v: number | null | undefined) => (v === null || v === undefined ? NaN : v);

/**
 * The flights a baseline uses: those of the same layout with enough hover to judge balance,
 * the most recent `driftMaxFlights` of them.
 */
export function usableBaseline(
  now: DriftSample,
  samples: readonly DriftSample[],
  th: Thresholds,
): DriftSample[] {
  const ok = samples.filter(
    (r) => r.deviationPct.length === now.deviationPct.length && r.hoverS >= th.minHoverForVerdictS,
  );
  return ok.slice(-th.driftMaxFlights);
}

/**
 * How this flight differs from the aircraft's recent flights: per motor, the baseline median
 * and spread of `deviationPct` and the change in points (nowPct − median); likewise the torque
 * split, CG, band RMS per axis, pack resistance and tracking lag. Null when fewer than
 * `driftMinFlights` earlier flights qualify.
 */
export function computeDrift(
  now: DriftSample,
  baseline: Baseline,
  th: Thresholds,
): { drift: Drift | null; findings: Finding[]; warning?: string } {
  const base = usableBaseline(now, baseline.samples, th);
  if (base.length < th.driftMinFlights || now.deviationPct.length === 0) {
    return {
      drift: null,
      findings: [],
      warning:
        `Drift needs at least ${th.driftMinFlights} earlier flights of this aircraft with enough ` +
        `hover; ${base.length} qualified.`,
    };
  }
  const label = baseline.label ?? `this aircraft's last ${base.length} flights`;
  const motors = now.deviationPct.map((nowPct, i) => {
    const values = base.map((r) => r.deviationPct[i]!);
    const baselinePct = median(values);
    return {
      motor: i + 1,
      baselinePct: round(baselinePct),
      spreadPct: round(spread(values)),
      nowPct: round(nowPct),
      changePts: round(nowPct - baselinePct),
    };
  });
  const asym = base.map((r) => r.asymmetryPct);
  const torqueSplit = {
    baselinePct: round(median(asym)),
    spreadPct: round(spread(asym)),
    nowPct: round(now.asymmetryPct),
    changePts: round(now.asymmetryPct - median(asym)),
  };
  const cgs = base.flatMap((r) => (r.cg ? [r.cg] : []));
  const cg =
    now.cg && cgs.length
      ? (() => {
          const x = median(cgs.map((c) => c.xMm));
          const y = median(cgs.map((c) => c.yMm));
          return {
            baselineXMm: round(x, 1),
            baselineYMm: round(y, 1),
            nowXMm: now.cg.xMm,
            nowYMm: now.cg.yMm,
            shiftMm: round(Math.hypot(now.cg.xMm - x, now.cg.yMm - y), 1),
          };
        })()
      : null;
  const vibration: Drift['vibration'] = {};
  for (const [channel, nowRms] of Object.entries(now.bandRms)) {
    const values = base.flatMap((r) =>
      r.bandRms[channel] !== undefined ? [r.bandRms[channel]] : [],
    );
    const m = median(values);
    if (!(m > 0)) continue;
    vibration[channel] = {
      baselineRms: round(m, 4),
      spreadRms: round(spread(values), 4),
      nowRms,
      ratio: round(nowRms / m, 3),
    };
  }
  const ohms = base.map((r) => num(r.internalResistanceOhm));
  const baseOhm = median(ohms);
  const nowOhm = num(now.internalResistanceOhm);
  const power =
    Number.isFinite(baseOhm) && Number.isFinite(nowOhm) && baseOhm > 0
      ? {
          baselineMilliohm: round(baseOhm * 1000, 1),
          spreadMilliohm: round(spread(ohms) * 1000, 1),
          nowMilliohm: round(nowOhm * 1000, 1),
          changePct: round((nowOhm / baseOhm - 1) * 100, 1),
        }
      : null;
  const lagOf = (axis: 'roll' | 'pitch' | 'yaw') => {
    const values = base.map((r) => num(r.lagMs?.[axis]));
    const m = median(values);
    const n = num(now.lagMs?.[axis]);
    if (!Number.isFinite(m) || !Number.isFinite(n)) return null;
    return {
      baselineMs: round(m),
      spreadMs: round(spread(values)),
      nowMs: round(n),
      changeMs: round(n - m),
    };
  };
  const tracking = now.lagMs
    ? { roll: lagOf('roll'), pitch: lagOf('pitch'), yaw: lagOf('yaw') }
    : null;
  const drift: Drift = {
    flights: base.length,
    against: label,
    motors,
    torqueSplit,
    cg,
    vibration,
    power,
    tracking,
  };
  return { drift, findings: driftFindings(drift, th) };
}

/** A change counts when it clears both its floor and the baseline's own spread. */
const beyond = (change: number, floor: number, spreadOf: number, th: Thresholds) =>
  change >= floor && change >= th.driftSpreads * spreadOf;

/** Findings for what moved beyond the aircraft's own flight-to-flight spread. */
export function driftFindings(d: Drift, th: Thresholds): Finding[] {
  const out: Finding[] = [];
  const against = `against ${d.against}`;
  for (const m of d.motors) {
    if (!beyond(m.changePts, th.motorDriftPts, m.spreadPct, th)) continue;
    out.push({
      code: 'motor-drift',
      severity: 'watch',
      motor: m.motor,
      changePts: m.changePts,
      flights: d.flights,
      message:
        `Motor ${m.motor} now works ${m.changePts.toFixed(1)} points harder than it used to ` +
        `(${signed(m.nowPct)} % now, ${signed(m.baselinePct)} % typical, flight-to-flight spread ` +
        `${m.spreadPct.toFixed(1)} points; ${against}). A wearing bearing or a damaged prop shows ` +
        `this way long before it crosses the fixed limits: with props OFF, spin it by hand for ` +
        `roughness, check the bell and shaft, and fit a new prop.`,
    });
  }
  const vib = Object.entries(d.vibration)
    .filter(([, v]) => v.ratio >= th.vibrationDriftRatio)
    .filter(([, v]) => v.nowRms - v.baselineRms >= th.driftSpreads * v.spreadRms)
    .sort((a, b) => b[1].ratio - a[1].ratio);
  if (vib.length) {
    const [channel, v] = vib[0]!;
    const others = vib.slice(1).map(([c]) => c);
    out.push({
      code: 'vibration-drift',
      severity: 'watch',
      axis: channel,
      flights: d.flights,
      message:
        `Vibration on ${channel} is ${v.ratio.toFixed(1)} times its usual level ` +
        `(band RMS ${v.nowRms.toFixed(2)} against ${v.baselineRms.toFixed(2)}` +
        `${others.length ? `; also up on ${others.join(', ')}` : ''}; ${against}). Something ` +
        `changed since those flights: with the battery out, check props for chips, motor ` +
        `screws, the flight controller's mounts and anything newly fitted.`,
    });
  }
  const p = d.power;
  if (
    p &&
    beyond(p.changePct, th.packAgeingPct, (p.spreadMilliohm / p.baselineMilliohm) * 100, th)
  ) {
    out.push({
      code: 'pack-ageing',
      severity: 'watch',
      flights: d.flights,
      message:
        `Pack resistance is ${p.changePct.toFixed(0)} % above its usual ` +
        `(${p.nowMilliohm.toFixed(0)} mΩ against ${p.baselineMilliohm.toFixed(0)} mΩ; ${against}). ` +
        `If this was the usual pack, it is ageing: check each cell's resting voltage and ` +
        `resistance on a charger, and retire packs that sag or puff. Charge LiPos on a fireproof ` +
        `surface and never unattended.`,
    });
  }
  for (const axis of ['roll', 'pitch'] as const) {
    const t = d.tracking?.[axis];
    if (!t || !beyond(t.changeMs, th.responseDriftMs, t.spreadMs, th)) continue;
    out.push({
      code: 'response-drift',
      severity: 'note',
      axis,
      flights: d.flights,
      message:
        `On ${axis} the aircraft now trails the sticks by ${t.nowMs.toFixed(0)} ms, ` +
        `${t.changeMs.toFixed(0)} ms more than usual (${against}). A changed filter or gain, ` +
        `softer motor response (worn bearings, a hot ESC) or a new, heavier prop does this.`,
    });
  }
  return out;
}

const signed = (v: number) => `${v >= 0 ? '+' : '−'}${Math.abs(v).toFixed(1)}`;
