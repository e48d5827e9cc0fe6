import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ResetRequestInput } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerError } from '../../../lib/form-errors';
import { useRequestReset } from '../../../api/auth';

export function ResetRequestForm() {
  const request = useRequestReset();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(ResetRequestInput, plainMessages),
    defaultValues: { email: '' },
  });

  if (request.isSuccess)
    return (
      <Alert tone="ok">
        {request.data.message ??
          'If an account uses that address, a link to choose a new password is on its way. It works once and expires soon.'}
      </Alert>
    );

  return (
    <form
      noValidate
      aria-label="Reset password"
      className="space-y-4"
      onSubmit={handleSubmit((input) => {
        setFormError(null);
        request.mutate(input, {
          onError: (e) => setFormError(applyServerError(e, setError, ['email'])),
        });
      })}
    >
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        error={errors.email?.message}
        {...register('email')}
      />
      <Button type="submit" tone="primary" className="w-full" disabled={request.isPending}>
        Send reset link
      </Button>
    </form>
  );
}
