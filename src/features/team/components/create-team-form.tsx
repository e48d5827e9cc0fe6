import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { TeamInput, type Team } from '../../../../shared/schemas/teams';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerError } from '../../../lib/form-errors';
import { useCreateTeam } from '../../../api/teams';

export function CreateTeamForm({ onCreated }: { onCreated: (team: Team) => void }) {
  const create = useCreateTeam();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({ resolver: zodResolver(TeamInput, plainMessages), defaultValues: { name: '' } });
  return (
    <form
      noValidate
      aria-label="Create team"
      className="space-y-4"
      onSubmit={handleSubmit((input) => {
        setFormError(null);
        create.mutate(input, {
          onSuccess: onCreated,
          onError: (e) => setFormError(applyServerError(e, setError, ['name'])),
        });
      })}
    >
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField
        label="Team name"
        placeholder="Riverside flyers"
        error={errors.name?.message}
        {...register('name')}
      />
      <Button type="submit" tone="primary" disabled={create.isPending}>
        Create team
      </Button>
    </form>
  );
}
