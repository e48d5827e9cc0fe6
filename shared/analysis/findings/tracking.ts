import type { Finding, Severity } from '../../schemas/report';
import type { Thresholds } from '../../schemas/thresholds';
import type { TrackingResult } from '../tracking';

function lagLevel(ms: number, note: number, watch: number, act: number): Severity | null {
  if (ms >= act) return 'act';
  if (ms >= watch) return 'watch';
  if (ms >= note) return 'note';
  return null;
}

/**
 * Lag findings per axis, against limits set for a 5-inch build and scaled by (prop diameter ÷
 * 5 in)^1.5 for bigger props, never tightened for smaller ones: rotor inertia grows steeply with
 * diameter and big rigs are tuned softer, so a 10-inch rig trails about 2.8 times as far (from
 * memory; the exponent is our judgement).
 */
export function trackingFindings(
  tracking: TrackingResult,
  propDiameterIn: number,
  th: Thresholds,
): Finding[] {
  const size = Math.max(1, propDiameterIn / 5) ** 1.5;
  const out: Finding[] = [];
  for (const axis of ['roll', 'pitch', 'yaw'] as const) {
    const t = tracking[axis];
    if (t.lagMs === null) continue;
    const sev =
      axis === 'yaw'
        ? lagLevel(
            t.lagMs,
            th.trackingYawLagNoteMs * size,
            th.trackingYawLagWatchMs * size,
            th.trackingYawLagActMs * size,
          )
        : lagLevel(
            t.lagMs,
            th.trackingLagNoteMs * size,
            th.trackingLagWatchMs * size,
            th.trackingLagActMs * size,
          );
    if (!sev) continue;
    out.push({
      code: 'tracking-lag',
      severity: sev,
      axis,
      tS: t.worstAtS,
      message:
        `On ${axis} the aircraft follows the sticks about ${Math.round(t.lagMs)} ms late. ` +
        `The usual causes: heavy gyro or D-term filtering (see the filter bench), low P or ` +
        `feedforward gains, a low loop rate, or slow motor response (heavy props, ESC settings); ` +
        `on the bench with props OFF, also check the radio link's latency settings.`,
    });
  }
  return out;
}
