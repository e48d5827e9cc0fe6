import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { TeamPatch } from '../../../../shared/schemas/teams';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerError } from '../../../lib/form-errors';
import { useRenameTeam } from '../../../api/teams';

export function TeamNameForm({ teamId, name }: { teamId: string; name: string }) {
  const rename = useRenameTeam(teamId);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isDirty },
  } = useForm({ resolver: zodResolver(TeamPatch, plainMessages), values: { name } });
  return (
    <form
      noValidate
      aria-label="Team name"
      className="flex flex-wrap items-end gap-3"
      onSubmit={handleSubmit((input) => {
        setFormError(null);
        rename.mutate(input, {
          onError: (e) => setFormError(applyServerError(e, setError, ['name'])),
        });
      })}
    >
      <TextField
        label="Team name"
        className="w-64"
        error={errors.name?.message}
        {...register('name')}
      />
      <Button type="submit" disabled={!isDirty || rename.isPending}>
        Rename
      </Button>
      {formError && <Alert tone="error">{formError}</Alert>}
    </form>
  );
}
