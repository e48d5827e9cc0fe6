import type { Severity } from '../../../shared/schemas/report';

const styles: Record<Severity, string> = {
  note: 'border-sev-note/40 text-sev-note',
  watch: 'border-sev-watch/50 text-sev-watch',
  act: 'border-sev-act/50 bg-sev-act/5 text-sev-act',
};

/** Worst severity of a verdict; null means the verdict found nothing to report. */
export function SeverityBadge({ severity }: { severity: Severity | null }) {
  if (!severity)
    return (
      <span className="rounded-sm border border-ok/40 px-1.5 py-0.5 text-xs text-ok">clear</span>
    );
  return (
    <span className={'rounded-sm border px-1.5 py-0.5 text-xs font-medium ' + styles[severity]}>
      {severity}
    </span>
  );
}
