import type { DriftOutcome } from '../../../../shared/analysis/baseline';
import type { Finding } from '../../../../shared/schemas/report';

const DRIFT_CODES = new Set(['motor-drift', 'vibration-drift', 'pack-ageing', 'response-drift']);

/**
 * The verdict's findings with the review's own drift judgement: the baseline the review found
 * replaces whatever drift the report was analysed with (none, for flights read in the app).
 */
export function withDrift(
  findings: readonly Finding[],
  drift: DriftOutcome | null | undefined,
): readonly Finding[] {
  if (!drift || drift.kind !== 'compared') return findings;
  return [...findings.filter((f) => !DRIFT_CODES.has(f.code)), ...drift.findings];
}
