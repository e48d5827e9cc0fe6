import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import {
  SEVERITIES,
  SEVERITIES_MOST_FIRST,
  type Finding,
  type Severity,
} from '../../../../shared/schemas/report';
import { rankFindings, sectionForFinding, sections } from '../model/sections';
import { SeverityBadge } from '../../../components/ui/severity-badge';
import { MotorMarker } from '../../../components/ui/motor-marker';

export interface VerdictListProps {
  flightId: string;
  findings: readonly Finding[];
  hoverS: number;
  /** Selecting a finding moves the shared cursor to its moment. */
  onSelect?: (finding: Finding) => void;
  /** What the flight was judged against for drift, under the findings. */
  comparedWith?: ReactNode;
}

const sectionLabel = (f: Finding) =>
  sections.find((s) => s.id === sectionForFinding(f))?.label ?? 'Evidence';

/** The verdict: findings most severe first, each with what to do and where the evidence is. */
export function VerdictList({
  flightId,
  findings,
  hoverS,
  onSelect,
  comparedWith,
}: VerdictListProps) {
  const ranked = rankFindings(findings);
  const counts = Object.fromEntries(SEVERITIES.map((s) => [s, 0])) as Record<Severity, number>;
  for (const f of findings) counts[f.severity]++;
  return (
    <section aria-labelledby="verdict-title" className="rounded border border-line bg-paper-raised">
      <header className="flex flex-wrap items-baseline gap-x-4 gap-y-1 border-b border-line px-4 py-2">
        <h2 id="verdict-title" className="text-base font-semibold text-slate-brand">
          Verdict
        </h2>
        <p className="num text-xs text-ink-soft">
          {SEVERITIES_MOST_FIRST.map((s) => `${counts[s]} ${s}`).join(' · ')} · {hoverS.toFixed(1)}{' '}
          s of hover measured
        </p>
      </header>
      {ranked.length === 0 ? (
        <p className="px-4 py-3 text-sm text-ink-soft">
          Nothing in this log stood out against the team&apos;s thresholds. That is a statement
          about this flight&apos;s data, not a clean bill of health for the aircraft.
        </p>
      ) : (
        <ol className="divide-y divide-line" aria-label="Findings">
          {ranked.map((f, i) => {
            const section = sectionForFinding(f);
            // The engine's message usually names the motor already; the colour dot stays either way.
            const named =
              f.motor !== undefined && new RegExp(`\\bmotor ${f.motor}\\b`, 'i').test(f.message);
            const search = f.tS !== undefined ? `?t=${Math.round(f.tS * 1000) / 1000}` : '';
            return (
              <li
                key={`${f.code}-${f.motor ?? ''}-${f.axis ?? ''}-${i}`}
                className="flex gap-3 px-4 py-2.5"
              >
                <SeverityBadge severity={f.severity} fixed />
                <div className="min-w-0 flex-1">
                  <p className="text-sm text-ink">
                    {f.motor !== undefined && (
                      <span className="mr-1.5 inline-flex items-center gap-1 font-medium">
                        <MotorMarker motor={f.motor} />
                        {named ? (
                          <span className="sr-only">Motor {f.motor}</span>
                        ) : (
                          `Motor ${f.motor}:`
                        )}
                      </span>
                    )}
                    {f.message}
                  </p>
                  <p className="mt-0.5 text-xs text-ink-faint">
                    <Link
                      to={`/flights/${flightId}/${section}${search}`}
                      onClick={() => onSelect?.(f)}
                      className="font-medium text-slate-brand underline decoration-line underline-offset-2 hover:decoration-slate-brand"
                    >
                      {`${sectionLabel(f)} evidence`}
                      {f.tS !== undefined && ` at ${f.tS.toFixed(2)} s`}
                    </Link>
                    {f.axis && <span className="num ml-2">axis {f.axis}</span>}
                  </p>
                </div>
              </li>
            );
          })}
        </ol>
      )}
      {comparedWith}
      <p className="border-t border-line px-4 py-2 text-xs text-ink-faint">
        Findings are advice drawn from the log. Local aviation rules and licensed maintenance
        practice come first; check on the bench with props off before you change anything.
      </p>
    </section>
  );
}
