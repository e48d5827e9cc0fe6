import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { InviteInput } from '../../../../shared/schemas/teams';
import { Role } from '../../../../shared/schemas/common';
import { Alert, ErrorNote } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/panel';
import { applyServerError } from '../../../lib/form-errors';
import { roleLabels } from '../../../lib/role-labels';
import { useCreateInvite } from '../api/team-mutations';
import { useInvites } from '../api/team-queries';

/** Invite by e-mail with a role; the link in the message works once and expires. */
export function InvitesPanel({ teamId }: { teamId: string }) {
  const invites = useInvites(teamId);
  const create = useCreateInvite(teamId);
  const [formError, setFormError] = useState<string | null>(null);
  // Expiry is judged against when the page was opened; the list refreshes with the query.
  const [now] = useState(Date.now);
  const [sent, setSent] = useState<{ email: string; link?: string | undefined } | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(InviteInput, plainMessages),
    defaultValues: { email: '', role: 'pilot' as const },
  });

  return (
    <div className="space-y-4">
      <form
        noValidate
        aria-label="Invite"
        className="flex flex-wrap items-end gap-3"
        onSubmit={handleSubmit((input) => {
          setFormError(null);
          setSent(null);
          create.mutate(input, {
            onSuccess: (invite) => {
              setSent({ email: invite.email, link: invite.link });
              reset({ email: '', role: input.role });
            },
            onError: (e) => setFormError(applyServerError(e, setError, ['email', 'role'])),
          });
        })}
      >
        <TextField
          label="E-mail"
          type="email"
          className="w-64"
          error={errors.email?.message}
          {...register('email')}
        />
        <SelectField
          label="Role"
          className="w-32"
          error={errors.role?.message}
          {...register('role')}
        >
          {Role.options.map((r) => (
            <option key={r} value={r}>
              {roleLabels[r]}
            </option>
          ))}
        </SelectField>
        <Button type="submit" tone="primary" disabled={create.isPending}>
          Send invite
        </Button>
      </form>
      {formError && <Alert tone="error">{formError}</Alert>}
      {sent && (
        <Alert tone="ok">
          Invitation e-mailed to <strong>{sent.email}</strong>.
          {sent.link && (
            <>
              {' '}
              You can also pass on the link:{' '}
              <span className="font-mono break-all">{sent.link}</span>
            </>
          )}
        </Alert>
      )}
      {invites.isPending ? (
        <Loading what="invitations" />
      ) : invites.isError ? (
        <ErrorNote error={invites.error} />
      ) : invites.data.invites.length > 0 ? (
        <table className="w-full text-sm" aria-label="Invitations">
          <thead>
            <tr className="border-b border-line text-left text-xs text-ink-soft">
              <th className="py-1 pr-2 font-medium">E-mail</th>
              <th className="py-1 pr-2 font-medium">Role</th>
              <th className="py-1 pr-2 font-medium">By</th>
              <th className="py-1 pr-2 font-medium">State</th>
            </tr>
          </thead>
          <tbody>
            {invites.data.invites.map((i) => {
              const expired = !i.acceptedAt && new Date(i.expiresAt).getTime() < now;
              return (
                <tr key={i.id} className="border-b border-line/60">
                  <td className="py-1.5 pr-2 font-mono text-xs">{i.email}</td>
                  <td className="py-1.5 pr-2">{roleLabels[i.role]}</td>
                  <td className="py-1.5 pr-2 text-ink-soft">{i.invitedBy}</td>
                  <td className="py-1.5 pr-2 text-xs">
                    {i.acceptedAt ? (
                      <span className="text-ok">
                        joined {new Date(i.acceptedAt).toLocaleDateString()}
                      </span>
                    ) : expired ? (
                      <span className="text-ink-faint">expired</span>
                    ) : (
                      <span className="text-accent">
                        open until {new Date(i.expiresAt).toLocaleDateString()}
                      </span>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      ) : null}
    </div>
  );
}
