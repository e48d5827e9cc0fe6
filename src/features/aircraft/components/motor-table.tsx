import { useWatch, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { MotorMarker } from '../../../components/ui/motor-marker';
import { ScrollX } from '../../../components/ui/scroll-x';
import { AirframeForm, optionalNumber, sharesOrNull } from '../model/airframe-form';

const num = { setValueAs: optionalNumber };

/** Position and spin of every motor, numbered as the log's motorN columns, with its hover share. */
export function MotorTable({
  control,
  register,
  fields,
  errors,
  readOnly,
  onMove,
  onRemove,
  cg,
}: {
  control: Control<AirframeForm>;
  register: UseFormRegister<AirframeForm>;
  fields: { id: string }[];
  errors: NonNullable<FieldErrors<AirframeForm>['airframe']>['motors'];
  readOnly: boolean;
  onMove: (from: number, to: number) => void;
  onRemove: (index: number) => void;
  cg: { x: number; y: number } | undefined;
}) {
  const airframe = useWatch({ control, name: 'airframe' });
  // Expected shares are about the design CG: an offset CG loads the motors nearer to it.
  const { cg: _formCg, ...rest } = airframe;
  const shares = sharesOrNull(cg ? { ...rest, cg } : rest);
  return (
    <ScrollX label="Motors table">
      <table className="w-full text-sm" aria-label="Motors">
        <thead>
          <tr className="border-b border-line text-left text-xs text-ink-soft">
            <th className="py-1 pr-2 font-medium">Motor</th>
            <th className="py-1 pr-2 font-medium">x forward (mm)</th>
            <th className="py-1 pr-2 font-medium">y right (mm)</th>
            <th className="py-1 pr-2 font-medium">Spin (from above)</th>
            <th className="py-1 pr-2 text-right font-medium">Hover share</th>
            {!readOnly && <th className="py-1" />}
          </tr>
        </thead>
        <tbody>
          {fields.map((field, i) => {
            const n = i + 1;
            const rowError = errors?.[i];
            return (
              <tr key={field.id} className="border-b border-line/60" data-testid={`motor-row-${n}`}>
                <td className="py-1 pr-2">
                  <span className="inline-flex items-center gap-1.5 font-mono font-semibold">
                    <MotorMarker motor={n} />
                    {n}
                  </span>
                </td>
                <td className="py-1 pr-2">
                  <input
                    aria-label={`Motor ${n} x (mm)`}
                    aria-invalid={rowError?.x ? true : undefined}
                    title={rowError?.x?.message}
                    inputMode="decimal"
                    className={
                      'num w-24 rounded border bg-paper-raised px-2 py-1 ' +
                      (rowError?.x ? 'border-sev-act' : 'border-line')
                    }
                    {...register(`airframe.motors.${i}.x`, num)}
                  />
                </td>
                <td className="py-1 pr-2">
                  <input
                    aria-label={`Motor ${n} y (mm)`}
                    aria-invalid={rowError?.y ? true : undefined}
                    title={rowError?.y?.message}
                    inputMode="decimal"
                    className={
                      'num w-24 rounded border bg-paper-raised px-2 py-1 ' +
                      (rowError?.y ? 'border-sev-act' : 'border-line')
                    }
                    {...register(`airframe.motors.${i}.y`, num)}
                  />
                </td>
                <td className="py-1 pr-2">
                  <select
                    aria-label={`Motor ${n} spin`}
                    className="rounded border border-line bg-paper-raised px-2 py-1"
                    {...register(`airframe.motors.${i}.spin`)}
                  >
                    <option value="cw">clockwise</option>
                    <option value="ccw">counter-clockwise</option>
                  </select>
                </td>
                <td className="num py-1 pr-2 text-right text-ink-soft">
                  {shares?.[i] !== undefined ? `${(shares[i]! * 100).toFixed(1)} %` : '–'}
                </td>
                {!readOnly && (
                  <td className="py-1 text-right whitespace-nowrap">
                    <Button
                      size="sm"
                      tone="quiet"
                      aria-label={`Move motor ${n} up`}
                      disabled={i === 0}
                      onClick={() => onMove(i, i - 1)}
                    >
                      ↑
                    </Button>
                    <Button
                      size="sm"
                      tone="quiet"
                      aria-label={`Move motor ${n} down`}
                      disabled={i === fields.length - 1}
                      onClick={() => onMove(i, i + 1)}
                    >
                      ↓
                    </Button>
                    <Button
                      size="sm"
                      tone="quiet"
                      aria-label={`Remove motor ${n}`}
                      disabled={fields.length <= 3}
                      onClick={() => onRemove(i)}
                    >
                      ✕
                    </Button>
                  </td>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
    </ScrollX>
  );
}
