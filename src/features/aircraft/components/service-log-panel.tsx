import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ServiceEntryInput, ServiceKind } from '../../../../shared/schemas/aircraft';
import { Alert, ErrorNote } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { Empty, Loading } from '../../../components/ui/panel';
import { applyServerError } from '../../../lib/form-errors';
import { useAddServiceEntry, useDeleteServiceEntry } from '../../../api/aircraft-records';
import { useServiceLog } from '../../../api/aircraft-records';
import { optionalNumber } from '../model/airframe-form';

const kindLabels: Record<ServiceKind, string> = {
  repair: 'Repair',
  'part-swap': 'Part swap',
  'prop-change': 'Prop change',
  crash: 'Crash',
  inspection: 'Inspection',
  tune: 'Tune',
  other: 'Other',
};

const today = () => new Date().toISOString().slice(0, 10);

/** Repairs, swaps and crashes, newest first, so a change in the trends has a reason beside it. */
export function ServiceLogPanel({
  aircraftId,
  motorCount,
  canAdd,
}: {
  aircraftId: string;
  motorCount: number;
  canAdd: boolean;
}) {
  const log = useServiceLog(aircraftId);
  const add = useAddServiceEntry(aircraftId);
  const remove = useDeleteServiceEntry(aircraftId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(ServiceEntryInput, plainMessages),
    defaultValues: { date: today(), kind: 'repair' as ServiceKind, note: '' },
  });

  return (
    <div className="space-y-4">
      {canAdd && (
        <form
          noValidate
          aria-label="Add service entry"
          className="grid gap-3 rounded border border-line bg-paper-sunk p-3 sm:grid-cols-[9rem_9rem_7rem_1fr_auto] sm:items-end"
          onSubmit={handleSubmit((input) => {
            setFormError(null);
            add.mutate(input, {
              onSuccess: () =>
                reset({ date: input.date, kind: input.kind, note: '', motor: undefined }),
              onError: (e) =>
                setFormError(applyServerError(e, setError, ['date', 'kind', 'motor', 'note'])),
            });
          })}
        >
          <TextField label="Date" type="date" error={errors.date?.message} {...register('date')} />
          <SelectField label="Kind" error={errors.kind?.message} {...register('kind')}>
            {ServiceKind.options.map((k) => (
              <option key={k} value={k}>
                {kindLabels[k]}
              </option>
            ))}
          </SelectField>
          <SelectField
            label="Motor"
            error={errors.motor?.message}
            {...register('motor', { setValueAs: optionalNumber })}
          >
            <option value="">–</option>
            {Array.from({ length: motorCount }, (_, i) => (
              <option key={i} value={i + 1}>
                {i + 1}
              </option>
            ))}
          </SelectField>
          <TextAreaField
            label="What was done"
            rows={1}
            error={errors.note?.message}
            {...register('note')}
          />
          <Button type="submit" tone="primary" disabled={add.isPending}>
            Add entry
          </Button>
          {formError && (
            <div className="sm:col-span-5">
              <Alert tone="error">{formError}</Alert>
            </div>
          )}
        </form>
      )}
      {remove.isError && <ErrorNote error={remove.error} />}
      {log.isPending ? (
        <Loading what="the service log" />
      ) : log.isError ? (
        <ErrorNote error={log.error} />
      ) : log.data.entries.length === 0 ? (
        <Empty>No service entries yet.</Empty>
      ) : (
        <table className="w-full text-sm" aria-label="Service log">
          <thead>
            <tr className="border-b border-line text-left text-xs text-ink-soft">
              <th className="py-1 pr-2 font-medium">Date</th>
              <th className="py-1 pr-2 font-medium">Kind</th>
              <th className="py-1 pr-2 font-medium">Motor</th>
              <th className="py-1 pr-2 font-medium">Note</th>
              <th className="py-1 pr-2 font-medium">By</th>
              <th />
            </tr>
          </thead>
          <tbody>
            {log.data.entries.map((e) => (
              <tr key={e.id} className="border-b border-line/60 align-top">
                <td className="num py-1.5 pr-2 whitespace-nowrap">{e.date}</td>
                <td className="py-1.5 pr-2">{kindLabels[e.kind]}</td>
                <td className="num py-1.5 pr-2">{e.motor ?? '–'}</td>
                <td className="py-1.5 pr-2 whitespace-pre-wrap">{e.note}</td>
                <td className="py-1.5 pr-2 text-ink-soft">{e.by.name}</td>
                <td className="py-1.5 text-right">
                  {e.canDelete && (
                    <Button
                      size="sm"
                      tone="danger"
                      disabled={remove.isPending}
                      aria-label={`Delete the ${kindLabels[e.kind].toLowerCase()} entry of ${e.date}`}
                      onClick={() => {
                        if (
                          window.confirm(
                            `Delete the ${kindLabels[e.kind].toLowerCase()} entry of ${e.date} (“${e.note}”)? It leaves the service log for good.`,
                          )
                        )
                          remove.mutate(e.id);
                      }}
                    >
                      Delete
                    </Button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </div>
  );
}
