import { useId, useState } from 'react';
import type { PeakLabel } from '../../../../../shared/schemas/report';
import type {
  GroupablePeak,
  VibrationCause,
} from '../../../../../shared/analysis/vibration-groups';
import { MotorMarker } from '../../../../components/ui/motor-marker';

export const peakLabelText: Record<Exclude<PeakLabel, null>, string> = {
  'rotor-1x': 'rotor 1× (unbalance, bent shaft or prop)',
  'rotor-2x': 'rotor 2× (prop tracking, loose mount)',
  'blade-pass': 'blade pass (props passing the arms)',
  frame: 'frame (fixed frequency: a structural mode)',
};

const orderShort: Record<Exclude<PeakLabel, null | 'frame'>, string> = {
  'rotor-1x': '1×',
  'rotor-2x': '2×',
  'blade-pass': 'blade pass',
};

/** What a cause is called in its group row. */
export function causeTitle(c: VibrationCause): string {
  const top = c.members[0]!;
  switch (c.kind) {
    case 'rotor': {
      const who =
        c.motors.length === 1
          ? `Motor ${c.motors[0]}`
          : c.motors.length
            ? `Motor ${c.motors.slice(0, -1).join(', ')} or ${c.motors[c.motors.length - 1]}`
            : 'Rotors';
      const what =
        c.orders.length === 1
          ? peakLabelText[c.orders[0]!]
          : `rotor ${c.orders.map((o) => orderShort[o]).join(', ')}`;
      return `${who}: ${what}`;
    }
    case 'frame':
      return `Frame mode near ${Math.round(top.hz)} Hz (a fixed frequency)`;
    case 'electrical':
      return `Motor electrical noise, folded down by the log rate`;
    case 'line':
      return `Line near ${Math.round(top.hz)} Hz, not tied to rotor speed`;
  }
}

const fmtHz = (hz: number) => `${hz.toFixed(1)} Hz`;

function CauseRows({ cause, index }: { cause: VibrationCause; index: number }) {
  const [open, setOpen] = useState(false);
  const id = useId();
  const many = cause.members.length > 1;
  const top = cause.members[0]!;
  const [lo, hi] = cause.hzRange;
  const lines = cause.members.length;
  const title = (
    <>
      {cause.motors.length === 1 && (
        <span className="mr-1 inline-flex align-[-1px]">
          <MotorMarker motor={cause.motors[0]!} />
        </span>
      )}
      {causeTitle(cause)}
    </>
  );
  return (
    <tbody data-cause={cause.key} className="border-b border-line">
      <tr>
        <th scope="rowgroup" className="py-1.5 pr-2 text-left align-top font-normal">
          <span className="flex items-start gap-1.5">
            {many ? (
              <button
                type="button"
                aria-expanded={open}
                aria-controls={cause.members.map((_, i) => `${id}-m${i}`).join(' ')}
                onClick={() => setOpen((o) => !o)}
                className="-ml-0.5 flex items-start gap-1 rounded px-0.5 text-left text-ink hover:bg-line/40 focus-visible:outline focus-visible:outline-2"
              >
                <span aria-hidden className="num w-3 shrink-0 text-ink-faint">
                  {open ? '▾' : '▸'}
                </span>
                <span>{title}</span>
              </button>
            ) : (
              <span className="text-ink">{title}</span>
            )}
          </span>
          <span className="block pl-4 text-xs text-ink-faint">
            {many ? `${lines} peaks on ` : 'on '}
            {cause.channels.join(', ')}
          </span>
        </th>
        <td className="num py-1.5 pr-2 text-right align-top whitespace-nowrap">
          {lo === hi ? fmtHz(lo) : `${Math.round(lo)}–${Math.round(hi)} Hz`}
        </td>
        <td className="num py-1.5 text-right align-top" data-testid={`cause-${index}-level`}>
          {top.db.toFixed(1)}
        </td>
      </tr>
      {many &&
        open &&
        cause.members.map((p: GroupablePeak, i) => (
          <tr key={`${p.channel}-${p.hz}-${i}`} id={`${id}-m${i}`} className="text-ink-soft">
            <td className="py-0.5 pl-5 pr-2 text-xs">
              <span className="num">{p.channel}</span>
              {p.label && (cause.orders.length > 1 || cause.kind !== 'rotor') ? (
                <span> · {p.label === 'frame' ? 'frame' : orderShort[p.label]}</span>
              ) : null}
            </td>
            <td className="num py-0.5 pr-2 text-right text-xs">{fmtHz(p.hz)}</td>
            <td className="num py-0.5 text-right text-xs">{p.db.toFixed(1)}</td>
          </tr>
        ))}
    </tbody>
  );
}

/**
 * The peaks of the channels shown, one group row per cause (a rotor at every speed and
 * harmonic, a frame mode on every axis) that opens to its members. `unit` is the channels' PSD
 * unit, so the level column says what its decibels are relative to.
 */
export function VibrationPeakTable({
  causes,
  unit,
}: {
  causes: readonly VibrationCause[];
  unit: string;
}) {
  return (
    <table className="w-full table-fixed text-sm" aria-label="Vibration peaks">
      <colgroup>
        <col />
        <col className="w-[5.5rem]" />
        <col className="w-[5.5rem]" />
      </colgroup>
      <thead>
        <tr className="border-b border-line text-left text-xs tracking-wide text-ink-faint">
          <th scope="col" className="py-1 pr-2 font-medium uppercase">
            Source
          </th>
          <th scope="col" className="py-1 pr-2 text-right font-medium uppercase">
            Frequency
          </th>
          <th scope="col" className="py-1 text-right font-medium">
            <span className="uppercase">Level</span>
            <span className="block font-normal normal-case">dB re 1 {unit}</span>
          </th>
        </tr>
      </thead>
      {causes.length === 0 ? (
        <tbody>
          <tr>
            <td colSpan={3} className="py-2 text-ink-soft">
              No peak stands out of the noise floor.
            </td>
          </tr>
        </tbody>
      ) : (
        causes.map((c, i) => <CauseRows key={c.key} cause={c} index={i} />)
      )}
    </table>
  );
}
