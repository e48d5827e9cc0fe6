import { NoDataYet } from '../../../components/ui/no-data-yet';
import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { defaultThresholds, Thresholds } from '../../../../shared/schemas/thresholds';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerError } from '../../../lib/form-errors';
import { useReloadThresholds, useSaveThresholds, useThresholds } from '../../../api/thresholds';
import { VersionConflict } from '../../../components/ui/version-conflict';
import { isVersionConflict } from '../../../lib/api-fetch';

type Key = keyof Thresholds;
interface Row {
  key: Key;
  label: string;
  unit: string;
  /** For an act limit: its watch limit, and which way is worse (for cells a lower voltage). */
  watch?: { key: Key; worse: 'higher' | 'lower' };
}

/** The two rows of a watch/act pair; the act limit must be the stricter one. */
const watchAct = (
  label: string,
  unit: string,
  watch: Key,
  act: Key,
  worse: 'higher' | 'lower' = 'higher',
): Row[] => [
  { key: watch, label: `${label}: watch`, unit },
  { key: act, label: `${label}: act`, unit, watch: { key: watch, worse } },
];

const groups: { title: string; rows: Row[] }[] = [
  {
    title: 'Armed and hover',
    rows: [
      { key: 'armedMinOutput', label: 'Motor counts as spinning above', unit: '0–1' },
      { key: 'hoverRateDegS', label: 'Hover: roll and pitch rate under', unit: 'deg/s' },
      { key: 'hoverYawRateDegS', label: 'Hover: yaw rate under', unit: 'deg/s' },
      { key: 'hoverCollectiveBand', label: 'Hover: collective within ±', unit: '0–1' },
      { key: 'hoverAboveIdle', label: 'Hover: collective above idle by', unit: '0–1' },
      { key: 'hoverMinS', label: 'Shortest hover stretch', unit: 's' },
      { key: 'minHoverForVerdictS', label: 'Hover needed to judge balance', unit: 's' },
    ],
  },
  {
    title: 'Balance, CG and torque split',
    rows: [
      ...watchAct('Motor above expectation', '%', 'motorWatchPct', 'motorActPct'),
      ...watchAct('CG offset', '% of arm', 'cgWatchPctOfArm', 'cgActPctOfArm'),
      ...watchAct('Torque split asymmetry', '%', 'torqueSplitWatchPct', 'torqueSplitActPct'),
      ...watchAct('Motor thrust lost for its output', '%', 'motorLossWatchPct', 'motorLossActPct'),
      { key: 'patternConfidence', label: 'Always report a balance pattern this sure', unit: '0–1' },
    ],
  },
  {
    title: 'Vibration',
    rows: [
      { key: 'peakProminenceDb', label: 'Peak stands above its neighbours by', unit: 'dB' },
      ...watchAct('Gyro tone', 'deg/s', 'gyroToneWatchDegS', 'gyroToneActDegS'),
      ...watchAct('Accelerometer tone', 'g', 'accToneWatchG', 'accToneActG'),
      {
        key: 'toneDominantShare',
        label: 'Note a rotor or frame line carrying this share of its axis',
        unit: '0–1',
      },
    ],
  },
  {
    title: 'Headroom',
    rows: [
      { key: 'saturationLevel', label: 'Output counted as saturated', unit: '0–1' },
      ...watchAct('Time saturated', '% armed', 'saturationWatchPct', 'saturationActPct'),
      ...watchAct('Mean hover output', '0–1', 'hoverOutputWatch', 'hoverOutputAct'),
      { key: 'escOverActS', label: 'Time over ESC rating: act', unit: 's' },
    ],
  },
  {
    title: 'Battery and tracking',
    rows: [
      ...watchAct('Lowest cell under load', 'V', 'cellWatchV', 'cellActV', 'lower'),
      { key: 'trackingLagNoteMs', label: 'Roll and pitch lag behind setpoint: note', unit: 'ms' },
      ...watchAct(
        'Roll and pitch lag behind setpoint',
        'ms',
        'trackingLagWatchMs',
        'trackingLagActMs',
      ),
      { key: 'trackingYawLagNoteMs', label: 'Yaw lag behind setpoint: note', unit: 'ms' },
      ...watchAct('Yaw lag behind setpoint', 'ms', 'trackingYawLagWatchMs', 'trackingYawLagActMs'),
    ],
  },
  {
    title: 'Drift against the aircraft’s recent flights',
    rows: [
      { key: 'driftMinFlights', label: 'Fewest earlier flights for a baseline', unit: 'flights' },
      { key: 'driftMaxFlights', label: 'Most earlier flights in a baseline', unit: 'flights' },
      { key: 'motorDriftPts', label: 'Motor deviation moved by at least', unit: 'points' },
      { key: 'driftSpreads', label: '…and by at least', unit: '× its spread' },
      { key: 'vibrationDriftRatio', label: 'Band RMS risen to', unit: '× baseline' },
      { key: 'packAgeingPct', label: 'Pack resistance risen by', unit: '%' },
      { key: 'responseDriftMs', label: 'Roll and pitch lag risen by', unit: 'ms' },
    ],
  },
];

const ThresholdsForm = Thresholds.superRefine((t, ctx) => {
  for (const g of groups)
    for (const { key: act, watch } of g.rows) {
      if (!watch) continue;
      if (watch.worse === 'higher' ? t[act] <= t[watch.key] : t[act] >= t[watch.key])
        ctx.addIssue({
          code: 'custom',
          path: [act],
          message: watch.worse === 'higher' ? 'act must be above watch' : 'act must be below watch',
        });
    }
});

const num = { setValueAs: (v: unknown) => (v === '' ? undefined : Number(v)) };

/** The limits the verdict judges against, for this team; tuners and the owner change them. */
export function ThresholdsEditor({ teamId, canEdit }: { teamId: string; canEdit: boolean }) {
  const current = useThresholds(teamId);
  if (!current.data) return <NoDataYet query={current} what="thresholds" />;
  return (
    <ThresholdsForm_
      teamId={teamId}
      canEdit={canEdit}
      values={current.data.thresholds}
      isDefault={current.data.isDefault}
      updatedAt={current.data.updatedAt}
      version={current.data.version}
    />
  );
}

function ThresholdsForm_({
  teamId,
  canEdit,
  values,
  isDefault,
  updatedAt,
  version,
}: {
  teamId: string;
  canEdit: boolean;
  values: Thresholds;
  isDefault: boolean;
  updatedAt: string | null;
  /** The version `values` were read at; a save names it so a newer set is not overwritten. */
  version: number;
}) {
  const save = useSaveThresholds(teamId);
  const reload = useReloadThresholds(teamId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isDirty },
  } = useForm({ resolver: zodResolver(ThresholdsForm, plainMessages), values });

  return (
    <form
      noValidate
      aria-label="Thresholds"
      onSubmit={handleSubmit((input) => {
        setFormError(null);
        save.mutate(
          { input, version },
          {
            onError: (e) =>
              setFormError(
                isVersionConflict(e)
                  ? null
                  : applyServerError(e, setError, Object.keys(values) as Key[]),
              ),
          },
        );
      })}
      className="space-y-4"
    >
      <p className="text-xs text-ink-soft">
        {isDefault
          ? 'This team uses the defaults.'
          : `Saved ${updatedAt ? new Date(updatedAt).toLocaleString() : ''}.`}{' '}
        New limits apply to flights analysed from now on; a flight keeps the verdict it was given.
      </p>
      {formError && <Alert tone="error">{formError}</Alert>}
      <VersionConflict
        error={save.error}
        what="the thresholds"
        busy={save.isPending}
        onReload={() => void reload().then(() => save.reset())}
        onOverwrite={(current) =>
          save.variables && save.mutate({ ...save.variables, version: current })
        }
      />
      <fieldset disabled={!canEdit} className="grid gap-5 md:grid-cols-2">
        {groups.map((g) => (
          <div key={g.title}>
            <h3 className="mb-2 text-xs font-semibold tracking-wide text-ink-soft uppercase">
              {g.title}
            </h3>
            <div className="grid grid-cols-2 gap-2">
              {g.rows.map((r) => (
                <TextField
                  key={r.key}
                  label={`${r.label} (${r.unit})`}
                  numeric
                  inputMode="decimal"
                  hint={`default ${defaultThresholds[r.key]}`}
                  error={errors[r.key]?.message}
                  {...register(r.key, num)}
                />
              ))}
            </div>
          </div>
        ))}
      </fieldset>
      {canEdit && (
        <div className="flex gap-2">
          <Button type="submit" tone="primary" disabled={!isDirty || save.isPending}>
            Save thresholds
          </Button>
          <Button onClick={() => reset(defaultThresholds, { keepDefaultValues: true })}>
            Fill in defaults
          </Button>
        </div>
      )}
      {save.isSuccess && !isDirty && <Alert tone="ok">Thresholds saved.</Alert>}
    </form>
  );
}
