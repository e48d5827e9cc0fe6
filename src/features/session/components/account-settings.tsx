import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { ChangePasswordInput, PersonName, type Me } from '../../../../shared/schemas/auth';
import { z } from 'zod';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { applyServerError } from '../../../lib/form-errors';
import { plainMessages } from '../../../lib/plain-messages';
import { useChangePassword, useUpdateMe } from '../../../api/session';

const ProfileForm = z.object({ name: PersonName, commentMail: z.boolean() });

/** Name and the comment-mail preference; mentions and invitations always mail. */
export function ProfileSettings({ me }: { me: Me }) {
  const update = useUpdateMe();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isDirty },
  } = useForm({
    resolver: zodResolver(ProfileForm, plainMessages),
    values: { name: me.name, commentMail: me.commentMail },
  });
  return (
    <form
      noValidate
      aria-label="Profile"
      className="space-y-4"
      onSubmit={handleSubmit((input) => {
        setFormError(null);
        update.mutate(input, {
          onError: (e) => setFormError(applyServerError(e, setError, ['name', 'commentMail'])),
        });
      })}
    >
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField
        label="Name"
        className="max-w-sm"
        error={errors.name?.message}
        {...register('name')}
      />
      <label className="flex items-start gap-2 text-sm">
        <input type="checkbox" className="mt-1" {...register('commentMail')} />
        <span>
          E-mail me when someone comments on my flights or replies to me.
          <span className="block text-xs text-ink-faint">
            Mentions, review requests and invitations always arrive.
          </span>
        </span>
      </label>
      <Button type="submit" tone="primary" disabled={!isDirty || update.isPending}>
        Save
      </Button>
      {update.isSuccess && !isDirty && <Alert tone="ok">Saved.</Alert>}
    </form>
  );
}

export function PasswordSettings() {
  const change = useChangePassword();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(ChangePasswordInput, plainMessages),
    defaultValues: { currentPassword: '', newPassword: '' },
  });
  return (
    <form
      noValidate
      aria-label="Change password"
      className="max-w-sm space-y-4"
      onSubmit={handleSubmit((input) => {
        setFormError(null);
        change.mutate(input, {
          onSuccess: () => reset(),
          onError: (e) =>
            setFormError(applyServerError(e, setError, ['currentPassword', 'newPassword'])),
        });
      })}
    >
      {formError && <Alert tone="error">{formError}</Alert>}
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        error={errors.currentPassword?.message}
        {...register('currentPassword')}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. Other devices are signed out."
        error={errors.newPassword?.message}
        {...register('newPassword')}
      />
      <Button type="submit" disabled={change.isPending}>
        Change password
      </Button>
      {change.isSuccess && <Alert tone="ok">Password changed.</Alert>}
    </form>
  );
}
