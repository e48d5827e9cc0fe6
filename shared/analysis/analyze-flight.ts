import { defaultQuadX, presetAirframe } from '../airframe/presets';
import type { Column, ParsedLog } from '../log/types';
import type { Airframe } from '../schemas/airframe';
import { analyseBalance, hoverMeans, type BalanceResult } from './balance';
import { diagnose } from './diagnosis';
import { computeDrift, driftSample } from './drift';
import { downsampleMinMax } from './downsample';
import { decomposeEffort } from './effort';
import { buildFindings } from './findings';
import { estimateThrustLoss, thrustLossOf, type ThrustLoss } from './thrust-loss';
import { analyseHeadroom } from './headroom';
import { analysePower } from './power';
import { FlightReport, mostSevereFirst, REPORT_VERSION } from '../schemas/report';
import type { ReviewDetail, Trace } from './review-detail';
import { findSegments, motorColumns, type Ranges } from './segments';
import { resolveThresholds, type Thresholds } from '../schemas/thresholds';
import { analyseTracking, withoutSaturation } from './tracking';
import { responseCurves, trackingReport } from './tracking-report';
import { analyseVibration, toReviewSpectrum } from './vibration';
import { benchRunCurve, type BenchRunTable, type ThrustCurve } from './thrust-curve';

export interface AnalyzeOptions {
  /** The aircraft's geometry; without it a preset for the log's motor count is assumed. */
  airframe?: Airframe;
  thresholds?: Partial<Thresholds>;
  /**
   * A bench run of this motor and prop (throttle 0–1 → thrust in grams, the `BenchRow` shape):
   * the thrust proxy for balance, torque split and CG when rpm is not logged (shared/README.md §4).
   */
  benchRun?: BenchRunTable;
  /** Earlier reports of the same aircraft, oldest first: the flight is also judged against them (drift). */
  baseline?: { reports: readonly FlightReport[]; label?: string };
}

export interface FlightAnalysis {
  report: FlightReport;
  detail: ReviewDetail;
}

/** Thrown for logs the analysis cannot work with; `name` survives the worker boundary. */
export class AnalysisInputError extends Error {
  override name = 'AnalysisInputError';
}

const TRACE_POINTS = 4000;

/** Assumed geometry for a log without an airframe: our default quad X, or the hex/octo preset. */
function assumedAirframe(motorCount: number): Airframe {
  if (motorCount === 6) return presetAirframe('hex-x', { name: 'Unknown hex X' });
  if (motorCount === 8) return presetAirframe('octo-x', { name: 'Unknown octo X' });
  return defaultQuadX;
}

function presentColumns(log: ParsedLog, prefix: string, count: number): Column[] | null {
  const cols: Column[] = [];
  for (let i = 1; i <= count; i++) {
    const c = log.columns[`${prefix}${i}`];
    if (!c) return null;
    cols.push(c);
  }
  return count > 0 ? cols : null;
}

const round = (v: number, digits = 4) => {
  const f = 10 ** digits;
  return Math.round(v * f) / f;
};

/** Mid-time of the longest range, s. */
function longestMid(time: ArrayLike<number>, ranges: Ranges): number | null {
  let best: [number, number] | null = null;
  for (const r of ranges) if (!best || r[1] - r[0] > best[1] - best[0]) best = r;
  return best ? time[(best[0] + best[1]) >> 1]! : null;
}

/** A lone motor's thrust loss must explain nearly all of the hover moment imbalance to be named. */
const LOSS_EXPLAINED = 0.9;

/**
 * The weak motor's thrust loss: the diagnosis's motor when it names one, else the motor whose
 * loss alone explains the hover moments (never when a CG or spin-set pattern explains them).
 */
function lossOf(
  airframe: Airframe,
  balance: BalanceResult | null,
  diagnosis: ReturnType<typeof diagnose>,
): ThrustLoss | null {
  if (!balance || diagnosis.pattern === 'too-little-hover') return null;
  if (diagnosis.pattern === 'cg-offset' || diagnosis.pattern === 'spin-set') return null;
  const loss =
    diagnosis.pattern === 'weak-motor' && diagnosis.motor !== undefined
      ? thrustLossOf(airframe, balance.outputShare, diagnosis.motor)
      : estimateThrustLoss(airframe, balance.outputShare);
  return loss && loss.explained >= LOSS_EXPLAINED && loss.lossPct >= 1 ? loss : null;
}

/**
 * The whole analysis of one flight: the report (shared/README.md §7) and what the review charts
 * draw. Pure and synchronous; the same call runs in the worker, the server and the CLI.
 */
export function analyzeFlight(log: ParsedLog, options: AnalyzeOptions = {}): FlightAnalysis {
  const th = resolveThresholds(options.thresholds);
  const time = log.columns.time;
  if (!time || log.rows < 2 || !(log.sampleRateHz > 0)) {
    throw new AnalysisInputError('The log needs a time column and at least two rows to analyse.');
  }
  const motors = motorColumns(log);
  const motorCount = motors.length;
  const assumed = options.airframe === undefined;
  const airframe = options.airframe ?? assumedAirframe(motorCount);
  const warnings: string[] = log.warnings.map((w) =>
    w.line ? `Line ${w.line}: ${w.message}` : w.message,
  );
  if (motorCount > 0 && motorCount !== airframe.motors.length) {
    throw new AnalysisInputError(
      `The log has ${motorCount} motor columns but the airframe "${airframe.name}" has ` +
        `${airframe.motors.length} motors. Pick the airframe this log was flown with.`,
    );
  }
  if (assumed) {
    warnings.push(
      `No airframe given: assumed "${airframe.name}". Balance, CG and torque split are judged against that geometry.`,
    );
  }
  if (motorCount === 0)
    warnings.push('No motor outputs (motor1…) in the log: effort, balance and headroom need them.');
  const gamma = airframe.thrustExponent ?? 2;
  const rpms = presentColumns(log, 'rpm', motorCount);
  let bench: ThrustCurve | undefined;
  if (options.benchRun) {
    try {
      bench = benchRunCurve(options.benchRun);
    } catch (e) {
      throw new AnalysisInputError(e instanceof Error ? e.message : String(e));
    }
    if (rpms) warnings.push('rpm is logged, so balance and CG use rpm² rather than the bench run.');
  }

  const seg = findSegments(log, th);
  const armed: Ranges = seg.armed.length ? seg.armed : [[0, log.rows]];
  if (motorCount > 0 && seg.hoverS < th.minHoverForVerdictS) {
    warnings.push(
      `Only ${seg.hoverS.toFixed(1)} s of steady hover: balance, CG and torque split need ${th.minHoverForVerdictS} s to judge.`,
    );
  }

  const effort = motorCount > 0 ? decomposeEffort(airframe, motors, log.rows) : null;

  let balance: BalanceResult | null = null;
  let hoverOutput: number | null = null;
  if (motorCount > 0 && seg.hoverS > 0) {
    const means = hoverMeans(motors, rpms, seg.hover, gamma, bench);
    balance = analyseBalance(airframe, means, bench);
    hoverOutput = means.output.reduce((a, b) => a + b, 0) / motorCount;
  }
  const lossGuess = balance ? estimateThrustLoss(airframe, balance.outputShare) : null;
  const diagnosis = diagnose(
    airframe,
    balance,
    seg.hoverS,
    th,
    lossGuess && lossGuess.explained >= LOSS_EXPLAINED ? lossGuess.lossPct : 0,
  );
  const thrustLoss = lossOf(airframe, balance, diagnosis);

  const vibration = analyseVibration({
    log,
    ranges: armed,
    rpms,
    collective: effort?.collective ?? null,
    blades: airframe.prop.blades,
    ...(airframe.poles ? { poles: airframe.poles } : {}),
    prominenceDb: th.peakProminenceDb,
  });

  const cells = assumed ? undefined : airframe.cells;
  const power = analysePower(log, armed, cells);
  if (power?.cellsInferred)
    warnings.push(`Cell count inferred from the resting voltage: ${power.cells}S.`);
  const escMaxA = assumed ? undefined : airframe.escMaxA;
  const headroom = analyseHeadroom(
    log,
    motors,
    seg.armed,
    seg.floor,
    th.saturationLevel,
    escMaxA,
    gamma,
  );
  const tracking = analyseTracking(
    log,
    withoutSaturation(armed, headroom.saturationEvents, time, log.sampleRateHz),
  );
  if (tracking) {
    for (const axis of ['roll', 'pitch', 'yaw'] as const) {
      const note = tracking[axis].responseNote;
      if (note) warnings.push(`Stick response on ${axis}: ${note}.`);
    }
  }

  const findings = buildFindings({
    airframe,
    airframeAssumed: assumed,
    hoverS: seg.hoverS,
    armedS: seg.armedS,
    hoverOutput,
    hoverAtS: longestMid(time, seg.hover),
    balance,
    diagnosis,
    thrustLoss,
    vibration,
    power,
    headroom,
    tracking,
    warnings: log.warnings,
    th,
  });

  const report: FlightReport = {
    version: REPORT_VERSION,
    durationS: round(log.durationS, 4),
    sampleRateHz: round(log.sampleRateHz, 3),
    rows: log.rows,
    motorCount,
    channels: [...log.channels],
    warnings,
    airframe: { name: airframe.name, assumed },
    segments: {
      hoverS: round(seg.hoverS, 3),
      hover: seg.hover.map(
        ([a, b]) => [round(time[a]!, 3), round(time[b - 1]!, 3)] as [number, number],
      ),
    },
    balance: {
      expectedShare: (balance?.expectedShare ?? []).map((v) => round(v, 5)),
      measuredShare: (balance?.measuredShare ?? []).map((v) => round(v, 5)),
      deviationPct: (balance?.deviationPct ?? []).map((v) => round(v, 2)),
      thrustLoss: thrustLoss
        ? { motor: thrustLoss.motor, lossPct: round(thrustLoss.lossPct, 2), cg: thrustLoss.cg }
        : null,
    },
    torqueSplit: balance
      ? {
          cwShare: round(balance.cwShare, 5),
          ccwShare: round(balance.ccwShare, 5),
          asymmetryPct: round(balance.asymmetryPct, 2),
        }
      : { cwShare: 0, ccwShare: 0, asymmetryPct: 0 },
    cg: balance ? { xMm: round(balance.cg.xMm, 1), yMm: round(balance.cg.yMm, 1) } : null,
    vibration: Object.fromEntries(
      Object.entries(vibration.channels).map(([name, v]) => [
        name,
        {
          bandRms: round(v.bandRms, 4),
          peaks: v.peaks.map((p) => ({
            hz: round(p.hz, 2),
            db: round(p.db, 2),
            label: p.label,
            ...(p.motor ? { motor: p.motor } : {}),
            ...(p.candidates?.length ? { candidates: p.candidates } : {}),
            ...(p.aliasOfHz !== undefined ? { aliasOfHz: round(p.aliasOfHz, 1) } : {}),
          })),
        },
      ]),
    ),
    power: power
      ? {
          cells: power.cells,
          restCellV: round(power.restCellV, 3),
          minCellV: round(power.minCellV, 3),
          sagCellV: round(power.sagCellV, 3),
          internalResistanceOhm:
            power.internalResistanceOhm === null ? null : round(power.internalResistanceOhm, 5),
          mAh: power.mAh === null ? null : round(power.mAh, 1),
          wh: power.wh === null ? null : round(power.wh, 3),
        }
      : null,
    headroom: {
      saturationS: round(headroom.saturationS, 3),
      saturationEvents: headroom.saturationEvents.map((e) => ({
        t0: round(e.t0, 3),
        t1: round(e.t1, 3),
        motor: e.motor,
      })),
      escPeakA: headroom.escPeakA === null ? null : round(headroom.escPeakA, 2),
      escOverS: round(headroom.escOverS, 3),
    },
    tracking: tracking ? trackingReport(tracking) : null,
    findings,
    drift: null,
  };
  if (options.baseline) {
    const { reports, label } = options.baseline;
    const d = computeDrift(
      driftSample(report),
      { samples: reports.map(driftSample), ...(label !== undefined ? { label } : {}) },
      th,
    );
    report.drift = d.drift;
    if (d.warning) warnings.push(d.warning);
    report.findings = [...findings, ...d.findings].sort(mostSevereFirst);
  }

  const effortSeries: Record<string, ArrayLike<number>> = {};
  if (log.columns.throttle) effortSeries.throttle = log.columns.throttle;
  if (effort) {
    effortSeries.collective = effort.collective;
    effortSeries.effort_roll = effort.roll;
    effortSeries.effort_pitch = effort.pitch;
    effortSeries.effort_yaw = effort.yaw;
  }
  motors.forEach((m, i) => (effortSeries[`motor${i + 1}`] = m));
  const pick = (names: string[]): Record<string, Column> =>
    Object.fromEntries(names.flatMap((n) => (log.columns[n] ? [[n, log.columns[n]!]] : [])));
  const trackingCols = pick(['gyro_x', 'gyro_y', 'gyro_z', 'sp_roll', 'sp_pitch', 'sp_yaw']);
  let powerTrace: Trace | null = null;
  if (log.columns.vbat) {
    const cols: Record<string, ArrayLike<number>> = { vbat: log.columns.vbat };
    if (log.columns.ibat) cols.ibat = log.columns.ibat;
    powerTrace = downsampleMinMax(time, cols, TRACE_POINTS);
    // Per-cell voltage is the pack voltage scaled, so it is scaled after downsampling.
    if (power) powerTrace.series.cell_v = powerTrace.series.vbat!.map((v) => v / power.cells);
  }
  const detail: ReviewDetail = {
    effort: downsampleMinMax(time, effortSeries, TRACE_POINTS),
    tracking: Object.keys(trackingCols).length
      ? downsampleMinMax(time, trackingCols, TRACE_POINTS)
      : null,
    power: powerTrace,
    spectra: Object.fromEntries(
      Object.entries(vibration.channels).map(([n, v]) => [n, toReviewSpectrum(v.spectrum)]),
    ),
    campbell: vibration.campbell,
    stickResponse: tracking ? responseCurves(tracking) : null,
    diagnosis,
    airframe,
  };
  return { report, detail };
}
