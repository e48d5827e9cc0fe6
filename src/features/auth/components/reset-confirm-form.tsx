import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ResetConfirmInput, type Me } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerError } from '../../../lib/form-errors';
import { useConfirmReset } from '../../../api/auth';

export function ResetConfirmForm({ token, onDone }: { token: string; onDone: (me: Me) => void }) {
  const confirm = useConfirmReset();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(ResetConfirmInput, plainMessages),
    defaultValues: { token, password: '' },
  });

  return (
    <form
      noValidate
      aria-label="Password reset"
      className="space-y-4"
      onSubmit={handleSubmit((input) => {
        setFormError(null);
        confirm.mutate(input, {
          onSuccess: (answer) => onDone(answer.user),
          onError: (e) => setFormError(applyServerError(e, setError, ['password'])),
        });
      })}
    >
      {formError && <Alert tone="error">{formError}</Alert>}
      {errors.token && <Alert tone="error">This reset link is malformed; ask for a new one.</Alert>}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. Every device signed in to this account is signed out."
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" tone="primary" className="w-full" disabled={confirm.isPending}>
        Set new password
      </Button>
    </form>
  );
}
