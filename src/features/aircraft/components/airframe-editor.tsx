import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import {
  layoutPresets,
  presetAirframe,
  type LayoutPreset,
} from '../../../../shared/airframe/presets';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Caution } from '../../../components/ui/caution';
import { AirframeForm, optionalNumber, presetIds } from '../model/airframe-form';
import { AirframePreview } from './airframe-preview';
import { MotorTable } from './motor-table';

const num = { setValueAs: optionalNumber };
// A tenth of a millimetre is finer than any frame is built to.
const round1 = (v: number) => Math.round(v * 10) / 10;

/** The form as shown: motor positions to 0.1 mm (a preset's cos 45° arms are not). */
const toTenthMm = (form: AirframeForm): AirframeForm => ({
  ...form,
  airframe: {
    ...form.airframe,
    motors: form.airframe.motors.map((m) => ({ ...m, x: round1(m.x), y: round1(m.y) })),
  },
});

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
    defaultValues: toTenthMm(initial),
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
  const [cgX, setCgX] = useState(initial.airframe.cg ? String(round1(initial.airframe.cg.x)) : '');
  const [cgY, setCgY] = useState(initial.airframe.cg ? String(round1(initial.airframe.cg.y)) : '');
  const cg = readCg(cgX, cgY);

  const applyPreset = () => {
    const info = layoutPresets[preset];
    const arm = Number(armMm);
    const built = presetAirframe(preset, { armMm: arm > 0 ? arm : info.defaults.armMm });
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
      <AirframePreview control={control} cg={typeof cg === 'string' ? undefined : cg} />
    </form>
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
