import type { Airframe } from '../schemas/airframe';
import type { ReviewDetail } from './review-detail';
import { fitPatterns, type BalanceResult } from './balance';
import type { Thresholds } from '../schemas/thresholds';

export type Diagnosis = ReviewDetail['diagnosis'];

const list = (ms: number[]) =>
  ms.length <= 1 ? String(ms[0] ?? '') : `${ms.slice(0, -1).join(', ')} and ${ms[ms.length - 1]}`;

/**
 * The hover pattern in words with a confidence 0–1. Confidence is how much better the winning
 * pattern explains the motors' spread than the runner-up, scaled by how much hover there was
 * (full confidence from twice the minimum hover).
 */
export function diagnose(
  airframe: Airframe,
  balance: BalanceResult | null,
  hoverS: number,
  th: Thresholds,
  /** A lone motor's thrust loss that explains the hover moments, %, when one does. */
  lossPct = 0,
): Diagnosis {
  if (!balance || hoverS < th.minHoverForVerdictS) {
    return {
      pattern: 'too-little-hover',
      confidence: 0,
      text:
        `Too little hover to judge: ${hoverS.toFixed(1)} s of steady flight, ` +
        `${th.minHoverForVerdictS} s needed. Hold a steady hover for a few seconds in calm air next flight.`,
    };
  }
  const hoverFactor = Math.min(1, hoverS / (2 * th.minHoverForVerdictS));
  const dev = balance.deviationPct;
  const maxDev = Math.max(...dev.map(Math.abs));
  const radius =
    airframe.motors.reduce((s, m) => s + Math.hypot(m.x, m.y), 0) / airframe.motors.length;
  const design = airframe.cg ?? { x: 0, y: 0 };
  const cgPct = (Math.hypot(balance.cg.xMm - design.x, balance.cg.yMm - design.y) / radius) * 100;
  const asym = Math.abs(balance.asymmetryPct - balance.expectedAsymmetryPct);
  const strength = Math.max(
    maxDev / th.motorWatchPct,
    cgPct / th.cgWatchPctOfArm,
    asym / th.torqueSplitWatchPct,
    lossPct / th.motorLossWatchPct,
  );
  if (strength < 1) {
    return {
      pattern: 'healthy',
      confidence: Math.min(1, (1 - strength * 0.5) * hoverFactor),
      text:
        `Balanced: every motor within ${Math.max(1, Math.round(maxDev))} % of what the frame predicts in hover, ` +
        `no side or spin set loaded.`,
    };
  }
  const fits = fitPatterns(airframe, balance.outputShare, balance.expectedShare);
  const best = fits[0]!;
  const second = fits[1]?.explained ?? 0;
  const separation = best.explained >= 1 - 1e-9 ? 1 : (best.explained - second) / (1 - second);
  const confidence = Math.max(0, Math.min(1, separation * best.explained * hoverFactor));
  const d = balance.outputShare.map((v, i) => v - balance.expectedShare[i]!);
  const loaded = d.flatMap((v, i) => (v > 0 ? [i + 1] : []));
  switch (best.pattern) {
    case 'cg-offset': {
      const dx = balance.cg.xMm - design.x;
      const dy = balance.cg.yMm - design.y;
      const where = [
        Math.abs(dx) >= 1 ? `${Math.round(Math.abs(dx))} mm ${dx > 0 ? 'forward' : 'aft'}` : '',
        Math.abs(dy) >= 1 ? `${Math.round(Math.abs(dy))} mm ${dy > 0 ? 'right' : 'left'}` : '',
      ]
        .filter(Boolean)
        .join(' and ');
      return {
        pattern: 'cg-offset',
        confidence,
        text:
          `CG offset: motors ${list(loaded)} carry more with no yaw imbalance, so the weight sits ` +
          `${where || 'slightly off'} of the design point. Move the battery or payload the other way.`,
      };
    }
    case 'weak-motor': {
      const split = balance.asymmetryPct - balance.expectedAsymmetryPct;
      const yaw =
        Math.abs(split) >= 0.5
          ? `, and the ${split > 0 ? 'clockwise' : 'counter-clockwise'} props carry ` +
            `${Math.abs(split).toFixed(1)} % more of the hover effort to hold the heading`
          : '';
      return {
        pattern: 'weak-motor',
        ...(best.motor ? { motor: best.motor } : {}),
        confidence,
        text:
          `One motor: motor ${best.motor} needs more output than its neighbours for the same job${yaw} — ` +
          `a worn motor or a damaged prop rather than the CG. ` +
          `With props OFF, check its bearings, then swap its prop.`,
      };
    }
    case 'spin-set': {
      const heavy = balance.asymmetryPct >= balance.expectedAsymmetryPct ? 'cw' : 'ccw';
      const set = airframe.motors.flatMap((m, i) => (m.spin === heavy ? [i + 1] : []));
      return {
        pattern: 'spin-set',
        confidence,
        text:
          `One spin set: the ${heavy === 'cw' ? 'clockwise' : 'counter-clockwise'} motors (${list(set)}) ` +
          `work harder to hold the heading — mismatched props, a tilted motor or a twisted frame, not the CG.`,
      };
    }
  }
}
