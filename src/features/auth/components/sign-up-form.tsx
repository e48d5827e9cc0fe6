import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { SignUpInput, type Me } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerError } from '../../../lib/form-errors';
import { useSignUp } from '../../../api/auth';

/** New account; with an invite token the account joins that team on creation. */
export function SignUpForm({
  inviteToken,
  email,
  onSignedUp,
}: {
  inviteToken?: string;
  email?: string;
  onSignedUp: (me: Me) => void;
}) {
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(SignUpInput, plainMessages),
    defaultValues: {
      name: '',
      email: email ?? '',
      password: '',
      ...(inviteToken ? { inviteToken } : {}),
    },
  });

  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    signUp.mutate(input, {
      onSuccess: (answer) => onSignedUp(answer.user),
      onError: (error) =>
        setFormError(applyServerError(error, setError, ['name', 'email', 'password'])),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Create account">
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField
        label="Name"
        autoComplete="name"
        error={errors.name?.message}
        {...register('name')}
      />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        error={errors.email?.message}
        {...register('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters; a few unrelated words make a strong one."
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" tone="primary" className="w-full" disabled={signUp.isPending}>
        {signUp.isPending ? 'Creating account…' : 'Create account'}
      </Button>
    </form>
  );
}
