import { useMemo, useState } from 'react';
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  useReactTable,
} from '@tanstack/react-table';
import type { ColumnMap, ProposedColumnMap } from '../../../../shared/log/column-map';
import { channelFamily, channelNames } from '../../../../shared/log/channels';
import { doubtsAboutMap, type MapUnitDoubt } from '../../../../shared/log/map-unit-doubts';
import { describeUnit } from '../../../../shared/log/unit-fit';
import {
  checkDraft,
  draftAsFarAsFilled,
  draftFromProposal,
  type DraftRow,
} from '../model/column-map-draft';

export interface ColumnMapStepProps {
  fileName: string;
  proposal: ProposedColumnMap;
  /** A few rows of the file as written, to recognise each column by its values. */
  sampleRows?: string[][];
  /** A team preset that already covers some of these headers. */
  preset?: ColumnMap;
  /** Shown only to people who may save import presets (signed in, tuner or owner). */
  canSavePreset: boolean;
  onConfirm: (map: ColumnMap, presetName: string | null) => void;
  onCancel: () => void;
}

const helper = createColumnHelper<DraftRow & { index: number; doubt: MapUnitDoubt | null }>();
const channelOptions = channelNames(8);

/** A unit as the button names it: "µs", "m/s²", "raw 48–2047". */
const unitLabel = (u: { unit: string; min?: number; max?: number }) =>
  u.unit === 'raw'
    ? `raw ${u.min}–${u.max}`
    : (({ us: 'µs', 'm/s2': 'm/s²' } as Record<string, string>)[u.unit] ?? u.unit);

/**
 * The column-map step: the engine's proposal in a table, one row per column of the file, where
 * the person confirms or fixes each column's channel and unit. Nothing is applied until they
 * press "Read with this map".
 */
export function ColumnMapStep(props: ColumnMapStepProps) {
  const { fileName, proposal, sampleRows = [], preset, canSavePreset, onConfirm, onCancel } = props;
  const [rows, setRows] = useState<DraftRow[]>(() => draftFromProposal(proposal, preset));
  const [problems, setProblems] = useState<string[]>([]);
  const [savePreset, setSavePreset] = useState(false);
  const [presetName, setPresetName] = useState('');

  const update = (index: number, patch: Partial<DraftRow>) =>
    setRows((old) => old.map((r, i) => (i === index ? { ...r, ...patch } : r)));

  // Each column's first values against the unit it is about to be read in, as the person edits:
  // a µs motor read as a fraction imports cleanly and then gives a confident, wrong verdict.
  const doubts = useMemo(
    () =>
      doubtsAboutMap(draftAsFarAsFilled(rows), {
        headers: rows.map((r) => r.header),
        sampleRows,
        // A cell can only hold a comma when commas do not delimit: then it is a decimal comma.
        delimiter: sampleRows.some((r) => r.some((c) => c.includes(','))) ? ';' : ',',
      }),
    [rows, sampleRows],
  );

  const columns = useMemo(
    () => [
      helper.accessor('header', {
        header: 'Column in the file',
        cell: (c) => <span className="num text-ink">{c.getValue()}</span>,
      }),
      helper.display({
        id: 'sample',
        header: 'First values',
        // One value a line: a list wrapped mid-way reads as one odd number.
        cell: (c) => (
          <span className="num flex flex-col text-xs leading-tight text-ink-faint">
            {sampleRows.slice(0, 3).map((r, i) => (
              <span key={i} className="whitespace-nowrap">
                {r[c.row.original.index] ?? ''}
              </span>
            ))}
          </span>
        ),
      }),
      helper.accessor('channel', {
        header: 'Channel',
        cell: (c) => {
          const r = c.row.original;
          return (
            <select
              aria-label={`Channel for ${r.header}`}
              className="w-36 rounded border border-line-strong bg-paper-raised px-1 py-0.5 text-sm"
              value={r.channel}
              onChange={(e) => {
                const channel = e.target.value;
                const units = channelFamily(channel)?.units ?? [];
                update(r.index, {
                  channel,
                  unit: units.includes(r.unit as never) ? r.unit : (units[0] ?? ''),
                });
              }}
            >
              <option value="">— leave out —</option>
              {channelOptions.map((name) => (
                <option key={name} value={name}>
                  {name}
                </option>
              ))}
            </select>
          );
        },
      }),
      helper.accessor('unit', {
        header: 'Unit',
        cell: (c) => {
          const r = c.row.original;
          const units = r.channel ? (channelFamily(r.channel)?.units ?? []) : [];
          const likely = r.doubt?.likely;
          return (
            <div className="flex flex-col gap-1">
              <div className="flex items-center gap-1">
                <select
                  aria-label={`Unit for ${r.header}`}
                  className="w-24 rounded border border-line-strong bg-paper-raised px-1 py-0.5 text-sm disabled:opacity-40"
                  value={r.unit}
                  disabled={units.length === 0}
                  onChange={(e) => update(r.index, { unit: e.target.value })}
                >
                  {units.length === 0 && <option value="">—</option>}
                  {units.map((u) => (
                    <option key={u} value={u}>
                      {u}
                    </option>
                  ))}
                </select>
                {r.unit === 'raw' && (
                  <>
                    <input
                      aria-label={`Raw value at 0 % for ${r.header}`}
                      placeholder="0 %"
                      className="num w-16 rounded border border-line-strong px-1 py-0.5 text-sm"
                      value={r.min}
                      onChange={(e) => update(r.index, { min: e.target.value })}
                    />
                    <input
                      aria-label={`Raw value at 100 % for ${r.header}`}
                      placeholder="100 %"
                      className="num w-16 rounded border border-line-strong px-1 py-0.5 text-sm"
                      value={r.max}
                      onChange={(e) => update(r.index, { max: e.target.value })}
                    />
                  </>
                )}
              </div>
              {r.doubt && (
                <p className="max-w-xs text-xs text-sev-watch">
                  {r.doubt.message}{' '}
                  {likely && (
                    <button
                      type="button"
                      aria-label={`Read ${r.header} as ${describeUnit(likely.unit, r.channel, likely)}`}
                      className="mt-0.5 rounded border border-line-strong px-1.5 py-0.5 text-ink"
                      onClick={() =>
                        update(r.index, {
                          unit: likely.unit,
                          min: likely.min === undefined ? '' : String(likely.min),
                          max: likely.max === undefined ? '' : String(likely.max),
                        })
                      }
                    >
                      Use {unitLabel(likely)}
                    </button>
                  )}
                </p>
              )}
            </div>
          );
        },
      }),
      helper.accessor('reason', {
        header: 'Why',
        cell: (c) => <span className="text-xs text-ink-soft">{c.getValue()}</span>,
      }),
    ],
    [sampleRows],
  );

  const data = useMemo(
    () =>
      rows.map((r, index) => ({
        ...r,
        index,
        doubt: doubts.find((d) => d.header === r.header) ?? null,
      })),
    [rows, doubts],
  );
  // The table instance is rebuilt each render by design; nothing downstream memoises on it.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({ data, columns, getCoreRowModel: getCoreRowModel() });

  const confirm = () => {
    const check = checkDraft(rows);
    if (!check.ok) {
      setProblems(check.problems);
      return;
    }
    if (savePreset && presetName.trim() === '') {
      setProblems(['Give the preset a name, or untick "Save as team preset".']);
      return;
    }
    setProblems([]);
    onConfirm(check.map, savePreset ? presetName.trim() : null);
  };

  return (
    <section
      aria-labelledby="column-map-title"
      className="rounded border border-accent bg-paper-raised p-4"
    >
      <h2 id="column-map-title" className="text-base font-semibold text-slate-brand">
        Column map for <span className="num">{fileName}</span>
      </h2>
      <p className="mt-1 text-sm text-ink-soft">
        These headers are not in our canonical form. Here is what each column looks like to us;
        confirm or fix the channel and unit of each, and leave out what you do not need. Time and
        motor1 are required.
      </p>
      <div className="mt-3 overflow-x-auto">
        <table className="w-full border-collapse text-sm">
          <thead>
            {table.getHeaderGroups().map((g) => (
              <tr
                key={g.id}
                className="border-b border-line text-left text-xs uppercase tracking-wide text-ink-faint"
              >
                {g.headers.map((h) => (
                  <th key={h.id} className="px-2 py-1 font-medium">
                    {flexRender(h.column.columnDef.header, h.getContext())}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id} className="border-b border-line/60 align-middle">
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-2 py-1">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {doubts.length > 0 && (
        <p role="status" className="mt-3 text-sm text-sev-watch">
          {doubts.length === 1
            ? `The values of "${doubts[0]!.header}" do not look like its unit`
            : `The values of ${doubts.length} columns do not look like their units`}
          : see the note under each unit. Read as they are, they would give a confident but wrong
          verdict.
        </p>
      )}
      {problems.length > 0 && (
        <ul role="alert" className="mt-3 list-disc pl-5 text-sm text-sev-act">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
      <div className="mt-4 flex flex-wrap items-center gap-3">
        <button
          type="button"
          onClick={confirm}
          className="rounded bg-slate-brand px-3 py-1.5 text-sm font-medium text-paper"
        >
          Read with this map
        </button>
        <button
          type="button"
          onClick={onCancel}
          className="rounded border border-line px-3 py-1.5 text-sm text-ink-soft"
        >
          Cancel
        </button>
        {canSavePreset && (
          <label className="flex items-center gap-2 text-sm text-ink-soft">
            <input
              type="checkbox"
              checked={savePreset}
              onChange={(e) => setSavePreset(e.target.checked)}
            />
            Save as team preset
          </label>
        )}
        {canSavePreset && savePreset && (
          <input
            aria-label="Preset name"
            placeholder="e.g. Kite card export"
            className="rounded border border-line-strong px-2 py-1 text-sm"
            value={presetName}
            onChange={(e) => setPresetName(e.target.value)}
          />
        )}
      </div>
    </section>
  );
}
