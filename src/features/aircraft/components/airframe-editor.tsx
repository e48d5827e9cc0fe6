import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import {
  useFieldArray,
  useForm,
  useWatch,
  type Control,
  type FieldErrors,
  type UseFormRegister,
} from 'react-hook-form';
import {
  layoutPresets,
  presetAirframe,
  type LayoutPreset,
} from '../../../../shared/airframe/presets';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Caution } from '../../../components/ui/caution';
import { motorColor } from '../../../components/charts/palette';
import { AirframeForm, optionalNumber, presetIds, sharesOrNull } from '../model/airframe-form';
import { MM_PER_INCH, overlappingProps } from '../model/top-view-geometry';
import { AirframeTopView } from './airframe-top-view';

const num = { setValueAs: optionalNumber };
const round1 = (v: number) => Math.round(v * 10) / 10;

/**
 * Airframe editor: a layout preset as a starting point, the motor table (position and spin of
 * every motor, numbered as the log's motorN columns), mass, prop, ESC and battery, with a live
 * top view drawn from what is typed.
 */
export function AirframeEditor({
  initial,
  onSubmit,
  readOnly = false,
  submitLabel = 'Save airframe',
  submitting = false,
  serverError,
}: {
  initial: AirframeForm;
  onSubmit: (value: AirframeForm) => void;
  readOnly?: boolean;
  submitLabel?: string;
  submitting?: boolean;
  serverError?: string | null;
}) {
  const form = useForm({
    resolver: zodResolver(AirframeForm, plainMessages),
    defaultValues: initial,
  });
  const {
    register,
    control,
    handleSubmit,
    setValue,
    getValues,
    formState: { errors, dirtyFields },
  } = form;
  const motors = useFieldArray({ control, name: 'airframe.motors' });
  const [preset, setPreset] = useState<LayoutPreset>('quad-x');
  const [armMm, setArmMm] = useState<string>(String(layoutPresets['quad-x'].defaults.armMm));
  // The design CG is optional as a pair: both coordinates or neither (the frame centre).
  const [cgX, setCgX] = useState(initial.airframe.cg ? String(initial.airframe.cg.x) : '');
  const [cgY, setCgY] = useState(initial.airframe.cg ? String(initial.airframe.cg.y) : '');
  const cg = readCg(cgX, cgY);

  const applyPreset = () => {
    const info = layoutPresets[preset];
    const arm = Number(armMm);
    const built = presetAirframe(preset, { armMm: arm > 0 ? arm : info.defaults.armMm });
    // A tenth of a millimetre is finer than any frame is built to.
    motors.replace(built.motors.map((m) => ({ ...m, x: round1(m.x), y: round1(m.y) })));
    // Typical build values only fill what the pilot has not typed yet.
    const a = dirtyFields.airframe;
    if (!a?.massG) setValue('airframe.massG', built.massG);
    if (!a?.prop) setValue('airframe.prop', built.prop);
    if (!a?.cells) setValue('airframe.cells', built.cells);
    if (!a?.escMaxA) setValue('airframe.escMaxA', built.escMaxA);
    if (!a?.poles) setValue('airframe.poles', built.poles);
    if (!a?.name || !getValues('airframe.name')) setValue('airframe.name', info.label);
  };

  const airframeErrors = errors.airframe;
  const motorListError = airframeErrors?.motors?.root?.message ?? airframeErrors?.motors?.message;

  return (
    <form
      noValidate
      aria-label="Airframe"
      onSubmit={handleSubmit((value) => {
        if (typeof cg === 'string') return;
        const { cg: _old, ...airframe } = value.airframe;
        onSubmit({ ...value, airframe: cg ? { ...airframe, cg } : airframe });
      })}
      className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]"
    >
      <fieldset disabled={readOnly} className="min-w-0 space-y-5">
        {serverError && <Alert tone="error">{serverError}</Alert>}
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            label="Aircraft name"
            placeholder="Kite"
            error={errors.name?.message}
            {...register('name')}
          />
          <TextField
            label="Airframe name"
            placeholder="5-inch freestyle X"
            error={airframeErrors?.name?.message}
            {...register('airframe.name')}
          />
        </div>

        {!readOnly && (
          <div className="flex flex-wrap items-end gap-3 rounded border border-line bg-paper-sunk px-3 py-3">
            <SelectField
              label="Layout preset"
              value={preset}
              onChange={(e) => {
                const next = e.target.value as LayoutPreset;
                setPreset(next);
                setArmMm(String(layoutPresets[next].defaults.armMm));
              }}
              className="w-44"
            >
              {presetIds.map((id) => (
                <option key={id} value={id}>
                  {layoutPresets[id].label} ({layoutPresets[id].motorCount})
                </option>
              ))}
            </SelectField>
            <TextField
              label="Arm, centre to motor (mm)"
              inputMode="decimal"
              numeric
              value={armMm}
              onChange={(e) => setArmMm(e.target.value)}
              className="w-44"
            />
            <Button onClick={applyPreset}>Fill table from preset</Button>
            <p className="basis-full text-xs text-ink-faint">{layoutPresets[preset].description}</p>
          </div>
        )}

        <MotorTable
          control={control}
          register={register}
          fields={motors.fields}
          errors={airframeErrors?.motors}
          readOnly={readOnly}
          onMove={(from, to) => motors.move(from, to)}
          onRemove={(i) => motors.remove(i)}
          cg={typeof cg === 'string' ? undefined : cg}
        />
        {motorListError && <Alert tone="error">{motorListError}</Alert>}
        {!readOnly && (
          <Button
            size="sm"
            onClick={() =>
              motors.append({ x: 0, y: 0, spin: motors.fields.length % 2 === 0 ? 'ccw' : 'cw' })
            }
          >
            Add motor
          </Button>
        )}

        <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <TextField
            label="Take-off mass (g)"
            numeric
            inputMode="decimal"
            error={airframeErrors?.massG?.message}
            {...register('airframe.massG', num)}
          />
          <TextField
            label="Prop diameter (in)"
            numeric
            inputMode="decimal"
            error={airframeErrors?.prop?.diameterIn?.message}
            {...register('airframe.prop.diameterIn', num)}
          />
          <TextField
            label="Prop pitch (in)"
            numeric
            inputMode="decimal"
            error={airframeErrors?.prop?.pitchIn?.message}
            {...register('airframe.prop.pitchIn', num)}
          />
          <TextField
            label="Blades"
            numeric
            inputMode="numeric"
            error={airframeErrors?.prop?.blades?.message}
            {...register('airframe.prop.blades', num)}
          />
          <TextField
            label="ESC rating (A, continuous)"
            numeric
            inputMode="decimal"
            error={airframeErrors?.escMaxA?.message}
            {...register('airframe.escMaxA', num)}
          />
          <TextField
            label="Battery cells (S)"
            numeric
            inputMode="numeric"
            error={airframeErrors?.cells?.message}
            {...register('airframe.cells', num)}
          />
          <TextField
            label="Motor poles"
            numeric
            inputMode="numeric"
            hint="For eRPM → rpm"
            error={airframeErrors?.poles?.message}
            {...register('airframe.poles', num)}
          />
          <TextField
            label="Thrust exponent γ"
            numeric
            inputMode="decimal"
            hint="Output^γ when rpm is not logged; 2 if empty"
            error={airframeErrors?.thrustExponent?.message}
            {...register('airframe.thrustExponent', num)}
          />
        </div>
        <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <TextField
            label="Design CG x forward (mm)"
            numeric
            inputMode="decimal"
            value={cgX}
            onChange={(e) => setCgX(e.target.value)}
            error={typeof cg === 'string' ? cg : undefined}
            hint="Empty: the frame centre"
          />
          <TextField
            label="Design CG y right (mm)"
            numeric
            inputMode="decimal"
            value={cgY}
            onChange={(e) => setCgY(e.target.value)}
          />
        </div>
        <Caution title="ESC and battery limits">
          Enter the ESC's continuous rating per channel, not the burst figure, and the pack's real
          cell count. Headroom findings are judged against these numbers; they do not replace the
          maker's limits.
        </Caution>

        {!readOnly && (
          <Button type="submit" tone="primary" disabled={submitting}>
            {submitting ? 'Saving…' : submitLabel}
          </Button>
        )}
      </fieldset>
      <LivePreview control={control} cg={typeof cg === 'string' ? undefined : cg} />
    </form>
  );
}

function MotorTable({
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
                  <span
                    aria-hidden
                    className="h-2.5 w-2.5 rounded-full"
                    style={{ background: motorColor(n) }}
                  />
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
  );
}

/** The CG pair from its two inputs: a point, undefined for neither, or a message. */
function readCg(x: string, y: string): { x: number; y: number } | undefined | string {
  if (x.trim() === '' && y.trim() === '') return undefined;
  const nx = Number(x.replace(',', '.'));
  const ny = Number(y.replace(',', '.'));
  if (x.trim() === '' || y.trim() === '' || !Number.isFinite(nx) || !Number.isFinite(ny))
    return 'give both CG coordinates in mm, or neither for the frame centre';
  return { x: nx, y: ny };
}

function LivePreview({
  control,
  cg,
}: {
  control: Control<AirframeForm>;
  cg: { x: number; y: number } | undefined;
}) {
  const airframe = useWatch({ control, name: 'airframe' });
  const motors = (airframe.motors ?? []).map((m) => ({
    x: Number(m?.x),
    y: Number(m?.y),
    spin: m?.spin === 'cw' ? ('cw' as const) : ('ccw' as const),
  }));
  const diameter = Number(airframe.prop?.diameterIn);
  const overlaps = Number.isFinite(diameter)
    ? overlappingProps(motors, (diameter * MM_PER_INCH) / 2)
    : [];
  const cw = motors.filter((m) => m.spin === 'cw').length;
  return (
    <aside className="space-y-2 lg:sticky lg:top-4 lg:self-start">
      <AirframeTopView motors={motors} propDiameterIn={diameter} cg={cg} />
      <p className="text-xs text-ink-soft">
        <span className="num">{motors.length}</span> motors · <span className="num">{cw}</span>{' '}
        clockwise · <span className="num">{motors.length - cw}</span> counter-clockwise
      </p>
      {cw !== motors.length - cw && (
        <Alert tone="info">
          Unequal numbers of clockwise and counter-clockwise props: yaw will need uneven effort.
        </Alert>
      )}
      {overlaps.length > 0 && (
        <Alert tone="error">
          Prop discs overlap: {overlaps.map(([a, b]) => `${a}–${b}`).join(', ')}. Check the
          positions or the prop size.
        </Alert>
      )}
    </aside>
  );
}
