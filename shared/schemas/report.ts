import { z } from 'zod';

/**
 * The flight report: what `npm run analyze -- --json` prints, what the worker hands the review
 * and what the server stores as a flight's summary. Field meanings are set out in
 * shared/README.md §7; extra sections (traces, spectra) live beside these and are optional so
 * the core stays small.
 */
export const REPORT_VERSION = 1;

/** Least to most severe: the one order every verdict, badge, filter and stored rank uses. */
export const Severity = z.enum(['note', 'watch', 'act']);
export type Severity = z.infer<typeof Severity>;
export const SEVERITIES: readonly Severity[] = Severity.options;
/** The same order read most severe first, as verdict counts are written ("1 act · 2 watch"). */
export const SEVERITIES_MOST_FIRST: readonly Severity[] = [...SEVERITIES].reverse();

/** 0 for `note` up to 2 for `act`. */
export function severityRank(s: Severity): number {
  return SEVERITIES.indexOf(s);
}

/** Sort comparator: most severe first (stable sorts keep the engine's order within a severity). */
export function mostSevereFirst(a: { severity: Severity }, b: { severity: Severity }): number {
  return severityRank(b.severity) - severityRank(a.severity);
}

export const FindingCode = z.enum([
  'motor-working-hard',
  'cg-offset',
  'torque-split',
  'vibration-peak',
  'rotor-harmonic',
  'frame-resonance',
  'motor-saturation',
  'esc-overcurrent',
  'battery-sag',
  'tracking-lag',
  'log-gap',
  'motor-drift',
  'vibration-drift',
  'pack-ageing',
  'response-drift',
]);
export type FindingCode = z.infer<typeof FindingCode>;

export const PeakLabel = z.enum(['rotor-1x', 'rotor-2x', 'blade-pass', 'frame']).nullable();
export type PeakLabel = z.infer<typeof PeakLabel>;

export const Finding = z.object({
  code: FindingCode,
  severity: Severity,
  /** 1-based motor number of the airframe. */
  motor: z.number().int().min(1).optional(),
  axis: z.string().optional(),
  /** Moment in the flight, s, that shows the finding best. */
  tS: z.number().optional(),
  /** Plain-language: what it is and what to check on the bench. */
  message: z.string(),
  /** Drift findings: the change in points (motor-drift) and how many earlier flights it was judged against. */
  changePts: z.number().optional(),
  flights: z.number().int().min(1).optional(),
  /**
   * Vibration findings: every peak of the one cause the finding stands for (each axis, speed
   * and harmonic it showed on), loudest first.
   */
  seen: z
    .array(z.object({ channel: z.string(), hz: z.number(), db: z.number(), label: PeakLabel }))
    .optional(),
});
export type Finding = z.infer<typeof Finding>;

export const Peak = z.object({
  hz: z.number(),
  /** 10·log10 of the one-sided PSD in (channel unit)²/Hz. */
  db: z.number(),
  label: PeakLabel,
  /** 1-based motor whose 1× or 2× order the peak follows, when rpm per motor is logged. */
  motor: z.number().int().min(1).optional(),
  /**
   * 1-based motors the line could come from, strongest first, when order tracking narrowed it
   * to a few but could not pick one.
   */
  candidates: z.array(z.number().int().min(1)).optional(),
  /** Where the tone really is, Hz, when it lies above Nyquist and folded down to `hz`. */
  aliasOfHz: z.number().optional(),
});
export type Peak = z.infer<typeof Peak>;

const AxisTracking = z.object({
  rmsDegS: z.number(),
  lagMs: z.number().nullable(),
  /**
   * Stick response (H1 estimate, setpoint to gyro): where the gain first falls 3 dB below its
   * low-frequency level, the highest gain, the phase delay at low frequency and the mean
   * coherence of the band read. Null when the sticks carried too little movement (a warning
   * says so); absent in reports written before they existed.
   */
  bandwidthHz: z.number().nullable().optional(),
  peakGainDb: z.number().nullable().optional(),
  phaseDelayMs: z.number().nullable().optional(),
  coherence: z.number().nullable().optional(),
});

const Spread = z.object({
  baselinePct: z.number(),
  spreadPct: z.number(),
  nowPct: z.number(),
  changePts: z.number(),
});
const LagDrift = z
  .object({ baselineMs: z.number(), spreadMs: z.number(), nowMs: z.number(), changeMs: z.number() })
  .nullable();

/**
 * Drift: this flight against the same aircraft's recent flights (the baseline). Medians and
 * spreads (median absolute deviation × 1.4826) over the baseline; `changePts` = now − median.
 */
export const Drift = z.object({
  flights: z.number().int().min(1),
  /** What the flight was compared with, in words ("Kite's last 6 flights, since …"). */
  against: z.string(),
  motors: z.array(Spread.extend({ motor: z.number().int().min(1) })),
  /** Of `torqueSplit.asymmetryPct`. */
  torqueSplit: Spread,
  cg: z
    .object({
      baselineXMm: z.number(),
      baselineYMm: z.number(),
      nowXMm: z.number(),
      nowYMm: z.number(),
      shiftMm: z.number(),
    })
    .nullable(),
  vibration: z.record(
    z.string(),
    z.object({
      baselineRms: z.number(),
      spreadRms: z.number(),
      nowRms: z.number(),
      ratio: z.number(),
    }),
  ),
  power: z
    .object({
      baselineMilliohm: z.number(),
      spreadMilliohm: z.number(),
      nowMilliohm: z.number(),
      changePct: z.number(),
    })
    .nullable(),
  tracking: z.object({ roll: LagDrift, pitch: LagDrift, yaw: LagDrift }).nullable(),
});
export type Drift = z.infer<typeof Drift>;

export const FlightReport = z.object({
  version: z.literal(REPORT_VERSION),
  durationS: z.number(),
  sampleRateHz: z.number(),
  rows: z.number().int(),
  motorCount: z.number().int(),
  channels: z.array(z.string()),
  warnings: z.array(z.string()),
  /** Name of the airframe used, and whether it was assumed rather than given. */
  airframe: z.object({ name: z.string(), assumed: z.boolean() }),
  segments: z.object({
    hoverS: z.number(),
    hover: z.array(z.tuple([z.number(), z.number()])),
  }),
  balance: z.object({
    expectedShare: z.array(z.number()),
    measuredShare: z.array(z.number()),
    deviationPct: z.array(z.number()),
    /**
     * One motor's thrust for its output short of its neighbours', %, from the hover moment
     * equations by least squares with the CG held at the design point; null when no lone motor
     * explains the hover. Absent in reports written before it existed.
     */
    thrustLoss: z
      .object({
        motor: z.number().int().min(1),
        lossPct: z.number(),
        cg: z.literal('design'),
      })
      .nullable()
      .optional(),
  }),
  torqueSplit: z.object({
    cwShare: z.number(),
    ccwShare: z.number(),
    asymmetryPct: z.number(),
  }),
  cg: z.object({ xMm: z.number(), yMm: z.number() }).nullable(),
  vibration: z.record(z.string(), z.object({ bandRms: z.number(), peaks: z.array(Peak).max(8) })),
  power: z
    .object({
      cells: z.number().int(),
      restCellV: z.number(),
      minCellV: z.number(),
      sagCellV: z.number(),
      internalResistanceOhm: z.number().nullable(),
      mAh: z.number().nullable(),
      wh: z.number().nullable(),
    })
    .nullable(),
  headroom: z.object({
    saturationS: z.number(),
    saturationEvents: z.array(
      z.object({ t0: z.number(), t1: z.number(), motor: z.number().int().min(1) }),
    ),
    escPeakA: z.number().nullable(),
    escOverS: z.number(),
  }),
  tracking: z.object({ roll: AxisTracking, pitch: AxisTracking, yaw: AxisTracking }).nullable(),
  findings: z.array(Finding),
  /** Null without a baseline; absent in reports written before drift existed. */
  drift: Drift.nullable().optional(),
});
export type FlightReport = z.infer<typeof FlightReport>;
