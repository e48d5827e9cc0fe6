import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
} from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import type { FlightSummary, ReviewState } from '../../../../shared/schemas/flights';
import { SEVERITIES_MOST_FIRST } from '../../../../shared/schemas/report';
import { SeverityBadge } from '../../../components/ui/severity-badge';
import { formatDuration, formatWhen } from './format';

const reviewLabels: Record<ReviewState, string> = {
  none: '–',
  requested: 'review asked',
  reviewed: 'reviewed',
  'changes-requested': 'changes asked',
};

const column = createColumnHelper<FlightSummary>();

const columns = [
  column.accessor('recordedAt', {
    header: 'Flown',
    cell: (c) => (
      <Link
        to={`/flights/${c.row.original.id}`}
        className="num text-slate-brand underline-offset-2 hover:underline"
      >
        {formatWhen(c.getValue())}
      </Link>
    ),
  }),
  column.accessor('aircraftName', { header: 'Aircraft' }),
  column.accessor((f) => f.pilot.name, { id: 'pilot', header: 'Pilot' }),
  column.accessor('durationS', {
    header: 'Length',
    cell: (c) => <span className="num">{formatDuration(c.getValue())}</span>,
    meta: { numeric: true },
  }),
  column.accessor('worstSeverity', {
    header: 'Verdict',
    cell: (c) => {
      const counts = c.row.original.findingCounts;
      return (
        <span className="flex items-center gap-2">
          <SeverityBadge severity={c.getValue()} />
          <span className="num text-xs text-ink-faint">
            {SEVERITIES_MOST_FIRST.filter((s) => counts[s] > 0)
              .map((s) => `${counts[s]} ${s}`)
              .join(' · ')}
          </span>
        </span>
      );
    },
  }),
  column.accessor('openComments', {
    header: 'Open threads',
    cell: (c) => (
      <span className={'num ' + (c.getValue() > 0 ? 'text-accent' : 'text-ink-faint')}>
        {c.getValue()}
      </span>
    ),
    meta: { numeric: true },
  }),
  column.accessor('reviewState', { header: 'Review', cell: (c) => reviewLabels[c.getValue()] }),
  column.accessor('fileName', {
    header: 'Log',
    cell: (c) => (
      <span
        className="block max-w-48 truncate font-mono text-xs text-ink-soft"
        title={c.getValue()}
      >
        {c.getValue()}
      </span>
    ),
  }),
];

/** The team's flights, newest first, one row each; the date opens the review. */
export function FlightTable({ flights }: { flights: FlightSummary[] }) {
  const table = useReactTable({
    data: flights,
    columns,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (f) => f.id,
  });
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label="Flights">
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id} className="border-b border-line text-left text-xs text-ink-soft">
              {group.headers.map((header) => (
                <th
                  key={header.id}
                  className={
                    'px-2 py-1.5 font-medium ' +
                    ((header.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric
                      ? 'text-right'
                      : '')
                  }
                >
                  {flexRender(header.column.columnDef.header, header.getContext())}
                </th>
              ))}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="border-b border-line/60 hover:bg-paper-sunk/60">
              {row.getVisibleCells().map((cell) => (
                <td
                  key={cell.id}
                  className={
                    'px-2 py-1.5 ' +
                    ((cell.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric
                      ? 'text-right'
                      : '')
                  }
                >
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
