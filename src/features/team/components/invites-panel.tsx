import { NoDataYet } from '../../../components/ui/no-data-yet';
import { zodResolver } from '@hookform/resolvers/zod';
import { plainMessages } from '../../../lib/plain-messages';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { InviteInput, type Invite } from '../../../../shared/schemas/teams';
import { Role } from '../../../../shared/schemas/common';
import { Alert, ErrorNote } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { applyServerError } from '../../../lib/form-errors';
import { roleLabels } from '../../../lib/role-labels';
import { useCreateInvite, useWithdrawInvite } from '../../../api/invites';
import { useInvites } from '../../../api/invites';
import { ScrollX } from '../../../components/ui/scroll-x';

/** Invite by e-mail with a role; the link in the message works once and expires. */
export function InvitesPanel({ teamId }: { teamId: string }) {
  const invites = useInvites(teamId);
  const create = useCreateInvite(teamId);
  const withdraw = useWithdrawInvite(teamId);
  const [formError, setFormError] = useState<string | null>(null);
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
      {withdraw.isError && <ErrorNote error={withdraw.error} />}
      {!invites.data ? (
        <NoDataYet query={invites} what="invitations" />
      ) : invites.data.invites.length > 0 ? (
        <ScrollX label="Invitations table">
          <table className="w-full text-sm" aria-label="Invitations">
            <thead>
              <tr className="border-b border-line text-left text-xs text-ink-soft">
                <th className="py-1 pr-2 font-medium">E-mail</th>
                <th className="py-1 pr-2 font-medium">Role</th>
                <th className="py-1 pr-2 font-medium">Sent</th>
                <th className="py-1 pr-2 font-medium">State</th>
                <th />
              </tr>
            </thead>
            <tbody>
              {invites.data.invites.map((i) => (
                <tr key={i.id} className="border-b border-line/60">
                  <td className="py-1.5 pr-2 font-mono text-xs">{i.email}</td>
                  <td className="py-1.5 pr-2">{roleLabels[i.role]}</td>
                  <td className="py-1.5 pr-2 text-ink-soft">
                    <span className="num">{day(i.createdAt)}</span> by {i.invitedBy}
                  </td>
                  <td className="py-1.5 pr-2 text-xs">
                    <InviteStateNote invite={i} />
                  </td>
                  <td className="py-1.5 text-right">
                    {i.state === 'open' && (
                      <Button
                        size="sm"
                        tone="danger"
                        disabled={withdraw.isPending}
                        aria-label={`Withdraw the invitation to ${i.email}`}
                        onClick={() => {
                          if (
                            window.confirm(
                              `Withdraw the invitation to ${i.email}? The link they were sent stops working.`,
                            )
                          )
                            withdraw.mutate(i.id);
                        }}
                      >
                        Withdraw
                      </Button>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </ScrollX>
      ) : null}
    </div>
  );
}

const day = (at: string) => new Date(at).toLocaleDateString();

/** The server's word on each invitation, with the date that goes with it. */
function InviteStateNote({ invite: i }: { invite: Invite }) {
  switch (i.state) {
    case 'accepted':
      return (
        <span className="text-ok">
          {i.acceptedBy ? `${i.acceptedBy} joined` : 'joined'} {i.acceptedAt && day(i.acceptedAt)}
        </span>
      );
    case 'withdrawn':
      return (
        <span className="text-ink-faint">
          withdrawn {i.withdrawnAt && day(i.withdrawnAt)}
          {i.withdrawnBy && ` by ${i.withdrawnBy}`}
        </span>
      );
    case 'expired':
      return <span className="text-ink-faint">expired {day(i.expiresAt)}</span>;
    case 'open':
      return <span className="text-accent-ink">open until {day(i.expiresAt)}</span>;
  }
}
