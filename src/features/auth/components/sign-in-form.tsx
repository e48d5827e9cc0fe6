import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { SignInInput, type Me } from '../../../../shared/schemas/auth';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerError } from '../../../lib/form-errors';
import { useSignIn } from '../../../api/auth';

export function SignInForm({ onSignedIn }: { onSignedIn: (me: Me) => void }) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(SignInInput, plainMessages),
    defaultValues: { email: '', password: '' },
  });

  const onSubmit = handleSubmit((input) => {
    setFormError(null);
    signIn.mutate(input, {
      onSuccess: (answer) => onSignedIn(answer.user),
      onError: (error) => setFormError(applyServerError(error, setError, ['email', 'password'])),
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label="Sign in">
      {formError && <Alert tone="error">{formError}</Alert>}
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
        autoComplete="current-password"
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" tone="primary" className="w-full" disabled={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
