import type { DriftOutcome } from '../../../../shared/analysis/baseline';

/**
 * One line under the verdict: what the flight was judged against for drift (the aircraft's
 * recent flights, since which service entry), or why it was not.
 */
export function DriftLine({ outcome }: { outcome: DriftOutcome | null }) {
  if (outcome === null)
    return (
      <p className="px-4 pt-2 text-xs text-ink-faint" data-testid="drift-line">
        Drift: looking for this aircraft’s recent flights…
      </p>
    );
  if (outcome.kind === 'none')
    return (
      <p className="px-4 pt-2 text-xs text-ink-soft" data-testid="drift-line">
        {outcome.reason}
      </p>
    );
  const n = outcome.findings.length;
  return (
    <p className="px-4 pt-2 text-xs text-ink-soft" data-testid="drift-line">
      <span className="font-medium text-ink">Drift</span> judged against {outcome.against}:{' '}
      {n === 0
        ? 'nothing moved beyond its usual flight-to-flight spread.'
        : `${n} change${n === 1 ? '' : 's'} beyond its usual flight-to-flight spread, listed above.`}
    </p>
  );
}
