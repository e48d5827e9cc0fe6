import type { Airframe } from '../../../../shared/schemas/airframe';
import { fmtDeviation } from '../../../components/airframe/airframe-top-view';

/**
 * The review's top view in words, for its text alternative: what it shows and the figures it
 * shows, in reading order (the picture's parts are not read out on their own).
 */
export function topViewSummary(
  airframe: Airframe,
  deviationPct: readonly number[],
  cg: { xMm: number; yMm: number } | null,
  flagged: ReadonlySet<number>,
): string {
  const marked = flagged.size ? `, motor ${[...flagged].join(' and ')} marked` : '';
  const devs = airframe.motors
    .map((_, i) => `motor ${i + 1} ${fmtDeviation(deviationPct[i] ?? NaN)}`)
    .join(', ');
  const cgText = cg ? `; estimated CG at x ${cg.xMm.toFixed(1)} mm, y ${cg.yMm.toFixed(1)} mm` : '';
  return `Top view of ${airframe.name}: ${airframe.motors.length} motors${marked}. Deviation from expected hover output: ${devs}${cgText}`;
}
