import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Components } from '../../../../shared/schemas/aircraft';
import { Alert, describeError } from '../../../components/ui/alert';
import { unlessConflict, VersionConflict } from '../../../components/ui/version-conflict';
import { Button } from '../../../components/ui/button';
import { TextAreaField, TextField } from '../../../components/ui/field';
import { Caution } from '../../../components/ui/caution';
import { optionalNumber } from '../model/airframe-form';
import { useReloadAircraft, useUpdateAircraft } from '../../../api/aircraft';

const PartsForm = z.object({ components: Components, notes: z.string().trim().max(4000) });
type PartsForm = z.infer<typeof PartsForm>;

const num = { setValueAs: optionalNumber };
const text = {
  setValueAs: (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v),
};

/** What is fitted: motors, props, ESC, battery, frame and flight controller, with free notes. */
export function PartsEditor({
  aircraftId,
  version,
  initial,
  readOnly,
}: {
  aircraftId: string;
  /** The aircraft version `initial` was read at; a save names it so a newer one is not lost. */
  version: number;
  initial: PartsForm;
  readOnly: boolean;
}) {
  const update = useUpdateAircraft(aircraftId);
  const reload = useReloadAircraft(aircraftId);
  const {
    register,
    handleSubmit,
    formState: { errors, isDirty },
  } = useForm({ resolver: zodResolver(PartsForm, plainMessages), values: initial });
  const e = errors.components;
  return (
    <form
      noValidate
      aria-label="Parts"
      className="space-y-4"
      onSubmit={handleSubmit((value) => update.mutate({ patch: value, version }))}
    >
      {unlessConflict(update.error) && <Alert tone="error">{describeError(update.error)}</Alert>}
      <VersionConflict
        error={update.error}
        what="this aircraft"
        busy={update.isPending}
        onReload={() => void reload().then(() => update.reset())}
        onOverwrite={(current) =>
          update.variables && update.mutate({ ...update.variables, version: current })
        }
      />
      <fieldset disabled={readOnly} className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <TextField
          label="Motors"
          error={e?.motors?.message}
          {...register('components.motors', text)}
        />
        <TextField
          label="Motor kV (rpm/V)"
          numeric
          error={e?.motorKv?.message}
          {...register('components.motorKv', num)}
        />
        <TextField
          label="Props"
          error={e?.props?.message}
          {...register('components.props', text)}
        />
        <TextField label="ESC" error={e?.esc?.message} {...register('components.esc', text)} />
        <TextField
          label="ESC rating (A continuous, per channel)"
          numeric
          error={e?.escRatingA?.message}
          {...register('components.escRatingA', num)}
        />
        <TextField
          label="Battery"
          error={e?.battery?.message}
          {...register('components.battery', text)}
        />
        <TextField
          label="Cells (S)"
          numeric
          error={e?.batteryCells?.message}
          {...register('components.batteryCells', num)}
        />
        <TextField
          label="Capacity (mAh)"
          numeric
          error={e?.batteryMah?.message}
          {...register('components.batteryMah', num)}
        />
        <TextField
          label="C rating (continuous)"
          numeric
          error={e?.batteryC?.message}
          {...register('components.batteryC', num)}
        />
        <TextField
          label="Frame"
          error={e?.frame?.message}
          {...register('components.frame', text)}
        />
        <TextField
          label="Flight controller"
          error={e?.flightController?.message}
          {...register('components.flightController', text)}
        />
        <TextAreaField
          label="Notes"
          rows={3}
          className="sm:col-span-2 lg:col-span-3"
          error={errors.notes?.message}
          {...register('notes')}
        />
      </fieldset>
      <Caution title="LiPo packs">
        Charge on a fireproof surface with a balance charger at the rate the maker gives, never
        unattended; store at storage voltage; retire packs that are puffed, dented or hot after a
        gentle flight.
      </Caution>
      {!readOnly && (
        <Button type="submit" tone="primary" disabled={!isDirty || update.isPending}>
          Save parts
        </Button>
      )}
      {update.isSuccess && !isDirty && <Alert tone="ok">Parts saved.</Alert>}
    </form>
  );
}
