import { z } from 'zod';
import { IsoDateTime } from './common';

/**
 * Limits the verdict judges against. Team settings (stored by the server, edited by tuners);
 * each default says why it is what it is.
 */
export const Thresholds = z.object({
  /** A motor counts as spinning (armed) above this output, 0–1: idle is typically 3–6 %, noise on a stopped motor well under 1 % (common practice). */
  armedMinOutput: z.number().min(0).max(0.5),
  /** Hover needs roll and pitch rates under this, deg/s: hover corrections stay within a few deg/s, deliberate moves start above ~30 deg/s (common practice). */
  hoverRateDegS: z.number().positive(),
  /** Same for yaw, deg/s: yaw is looser in a hover because of drift corrections (common practice). */
  hoverYawRateDegS: z.number().positive(),
  /** Collective must stay within ± this (0–1) of its 1 s mean: a hold wanders by 1–2 %, a climb changes it by 5 % or more (common practice). */
  hoverCollectiveBand: z.number().positive().max(0.5),
  /** Hover collective is at least this above the idle floor, 0–1, so sitting armed on the ground is not hover. */
  hoverAboveIdle: z.number().min(0).max(0.5),
  /** Shortest steady stretch that counts as hover, s (shared/README.md §6: ≥ 1 s). */
  hoverMinS: z.number().positive(),
  /** Less hover than this in total and balance, CG and torque split are not judged, s: a few seconds average out gusts and control noise. */
  minHoverForVerdictS: z.number().positive(),
  /** Motor output above expectation that raises `watch` / `act`, %: matched motors and props hover within 1–2 % of each other (common practice). */
  motorWatchPct: z.number().positive(),
  motorActPct: z.number().positive(),
  /** CG offset as a % of the mean arm radius raising `watch` / `act`: 5 % is a battery strap or camera shifted by a centimetre on a 5-inch frame (common practice). */
  cgWatchPctOfArm: z.number().positive(),
  cgActPctOfArm: z.number().positive(),
  /** cw−ccw asymmetry beyond what the airframe expects, % of hover effort, raising `watch` / `act` (common practice). */
  torqueSplitWatchPct: z.number().positive(),
  torqueSplitActPct: z.number().positive(),
  /** A balance pattern the diagnosis states with at least this confidence, 0–1, always reaches the verdict (at least as a `note`). */
  patternConfidence: z.number().min(0).max(1),
  /** Thrust lost by one motor for its output, against its neighbours, raising `watch` / `act`, %: matched motors and props agree within a few %, a chipped blade pair or worn motor costs 10 % and more (common practice). */
  motorLossWatchPct: z.number().positive(),
  motorLossActPct: z.number().positive(),
  /** A spectral peak must stand this far above its neighbourhood, dB (6 dB = twice the power of the floor twice over, clear of Welch variance). */
  peakProminenceDb: z.number().positive(),
  /** Amplitude of a gyro tone raising `watch` / `act`, deg/s: a few deg/s of rotor noise is normal before filtering, tens of deg/s heats motors (common practice). */
  gyroToneWatchDegS: z.number().positive(),
  gyroToneActDegS: z.number().positive(),
  /** Amplitude of an accelerometer tone raising `watch` / `act`, g: half a g of rotor tone is usual on a hard-mounted board; above ~1 g attitude estimates suffer (common practice). */
  accToneWatchG: z.number().positive(),
  accToneActG: z.number().positive(),
  /** A labelled rotor or frame line carrying at least this share of its axis's vibration power above 50 Hz, on an axis shaking twice as hard as the sensor's others, is a `note` even under the absolute limits, 0–1: what that axis mostly shakes at is worth a look. */
  toneDominantShare: z.number().min(0).max(1),
  /** Output counted as saturated, 0–1 (shared/README.md §6: 98 %). */
  saturationLevel: z.number().min(0.5).max(1),
  /** Share of armed time saturated raising `watch` / `act`, %: brief full-throttle punches are normal, long stretches mean no headroom left (common practice). */
  saturationWatchPct: z.number().positive(),
  saturationActPct: z.number().positive(),
  /** Mean hover output raising `watch` / `act`, 0–1: sport builds hover at 25–50 % and heavy lifters near 55 %; by 70 % little is left to climb and correct (common practice). */
  hoverOutputWatch: z.number().min(0).max(1),
  hoverOutputAct: z.number().min(0).max(1),
  /** Time over the ESC rating raising `act`, s (any time over raises `watch`): ratings are usually continuous with ~10 s bursts (common practice). */
  escOverActS: z.number().positive(),
  /** Lowest cell under load raising `watch` / `act`, V per cell (common practice: 3.5 V under load warning, 3.3 V land now). */
  cellWatchV: z.number().positive(),
  cellActV: z.number().positive(),
  /**
   * Roll/pitch lag of the gyro behind the setpoint raising `note` / `watch` / `act`, ms, for a
   * 5-inch build: a well-tuned one with feedforward follows within 5–10 ms, a soft tune or heavy
   * filtering trails by 20 ms and more (from memory; common practice among tuners). Scaled by
   * (prop diameter ÷ 5 in)^1.5 for bigger props, whose heavier rotors change speed more slowly.
   */
  trackingLagNoteMs: z.number().positive(),
  trackingLagWatchMs: z.number().positive(),
  trackingLagActMs: z.number().positive(),
  /** Same for yaw, ms: yaw acts through prop drag, far weaker than thrust, so it always trails by tens of ms (from memory). */
  trackingYawLagNoteMs: z.number().positive(),
  trackingYawLagWatchMs: z.number().positive(),
  trackingYawLagActMs: z.number().positive(),
  /** Fewest earlier flights (with enough hover) that make a baseline for drift. */
  driftMinFlights: z.number().int().min(2).max(50),
  /** Most recent earlier flights a baseline uses: recent enough to be today's aircraft, enough to know its flight-to-flight spread. */
  driftMaxFlights: z.number().int().min(2).max(50),
  /** A motor's deviation moving by at least this many points from its baseline median raises `motor-drift` (if also beyond the spread below): about a point is flight-to-flight noise on a healthy aircraft (common practice). */
  motorDriftPts: z.number().positive(),
  /** …and by at least this many times its baseline spread (median absolute deviation, scaled to a standard deviation). */
  driftSpreads: z.number().positive(),
  /** Band RMS of an axis rising by this factor over its baseline median raises `vibration-drift`: a new chip or loose screw doubles it, day-to-day variation stays within ±20 % (common practice). */
  vibrationDriftRatio: z.number().min(1),
  /** Pack resistance rising by this share over its baseline median raises `pack-ageing`, %: a LiPo is usually retired by the time its resistance has risen by half (common practice). */
  packAgeingPct: z.number().positive(),
  /** Roll/pitch lag rising by at least this many ms over its baseline median raises `response-drift` (if also beyond the spread), ms. */
  responseDriftMs: z.number().positive(),
});
export type Thresholds = z.infer<typeof Thresholds>;

export const defaultThresholds: Thresholds = {
  armedMinOutput: 0.02,
  hoverRateDegS: 20,
  hoverYawRateDegS: 30,
  hoverCollectiveBand: 0.03,
  hoverAboveIdle: 0.08,
  hoverMinS: 1,
  minHoverForVerdictS: 4,
  motorWatchPct: 4,
  motorActPct: 8,
  cgWatchPctOfArm: 5,
  cgActPctOfArm: 10,
  torqueSplitWatchPct: 3,
  torqueSplitActPct: 8,
  patternConfidence: 0.8,
  motorLossWatchPct: 8,
  motorLossActPct: 20,
  peakProminenceDb: 10,
  gyroToneWatchDegS: 5,
  gyroToneActDegS: 20,
  accToneWatchG: 1,
  accToneActG: 3,
  toneDominantShare: 0.5,
  saturationLevel: 0.98,
  saturationWatchPct: 2,
  saturationActPct: 8,
  hoverOutputWatch: 0.65,
  hoverOutputAct: 0.8,
  escOverActS: 1,
  cellWatchV: 3.5,
  cellActV: 3.3,
  trackingLagNoteMs: 10,
  trackingLagWatchMs: 25,
  trackingLagActMs: 50,
  trackingYawLagNoteMs: 80,
  trackingYawLagWatchMs: 150,
  trackingYawLagActMs: 300,
  driftMinFlights: 3,
  driftMaxFlights: 10,
  motorDriftPts: 1.5,
  driftSpreads: 3,
  vibrationDriftRatio: 1.5,
  packAgeingPct: 25,
  responseDriftMs: 5,
};

/** Defaults overlaid with a team's partial settings, validated. */
export function resolveThresholds(partial?: Partial<Thresholds>): Thresholds {
  return Thresholds.parse({ ...defaultThresholds, ...partial });
}

/** `PUT /api/teams/:teamId/thresholds` body: the full set (the editor starts from the current one). */
export const ThresholdsInput = Thresholds;
export type ThresholdsInput = z.infer<typeof ThresholdsInput>;

/** The team's thresholds; defaults fill anything never set. */
export const TeamThresholds = z.object({
  thresholds: Thresholds,
  /** True while the team has never saved its own. */
  isDefault: z.boolean(),
  updatedAt: IsoDateTime.nullable(),
  /** Adds one on every write; send it back in If-Match to refuse overwriting a newer one. */
  version: z.number().int().positive(),
});
export type TeamThresholds = z.infer<typeof TeamThresholds>;
