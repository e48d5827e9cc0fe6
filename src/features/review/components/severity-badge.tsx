import type { Severity } from '../../../../shared/schemas/report';
import { severityLabel } from '../model/sections';

const tone: Record<Severity, string> = {
  act: 'bg-sev-act text-paper',
  watch: 'bg-sev-watch text-paper',
  note: 'bg-sev-note/15 text-sev-note',
};

export function SeverityBadge({ severity }: { severity: Severity }) {
  return (
    <span
      className={`inline-block h-fit w-14 shrink-0 self-start rounded-sm px-1.5 py-0.5 text-center text-[11px] font-semibold uppercase tracking-wide ${tone[severity]}`}
    >
      {severityLabel[severity]}
    </span>
  );
}
