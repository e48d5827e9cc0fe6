import type { Severity } from '../../../shared/schemas/report';

/** Solid for what needs doing, outlined for a note: the word carries the meaning, not the colour. */
const tone: Record<Severity, string> = {
  act: 'bg-sev-act text-paper',
  watch: 'bg-sev-watch text-paper',
  note: 'bg-sev-note/15 text-sev-note',
};

const word: Record<Severity, string> = { act: 'Act', watch: 'Watch', note: 'Note' };

/**
 * A finding's severity, or a verdict's worst one; null means the verdict found nothing to report.
 * `fixed` gives every badge one width, so a column of findings lines up.
 */
export function SeverityBadge({
  severity,
  fixed = false,
}: {
  severity: Severity | null;
  fixed?: boolean;
}) {
  const base =
    'inline-block h-fit shrink-0 rounded-sm px-1.5 py-0.5 text-center text-[11px] font-semibold uppercase tracking-wide ' +
    (fixed ? 'w-14 self-start ' : '');
  if (!severity) return <span className={base + 'border border-ok/40 text-ok'}>clear</span>;
  return <span className={base + tone[severity]}>{word[severity]}</span>;
}
