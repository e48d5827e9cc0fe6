import { NoDataYet } from '../../../components/ui/no-data-yet';
import type { Role } from '../../../../shared/schemas/common';
import { Role as RoleSchema } from '../../../../shared/schemas/common';
import { ErrorNote } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { roleDescriptions, roleLabels } from '../../../lib/role-labels';
import { useChangeRole, useRemoveMember } from '../../../api/members';
import { useMembers } from '../../../api/members';
import { ScrollX } from '../../../components/ui/scroll-x';

/** Who is in the team and as what; the owner changes roles and removes members here. */
export function MembersTable({
  teamId,
  canManage,
  myUserId,
}: {
  teamId: string;
  canManage: boolean;
  myUserId: string;
}) {
  const members = useMembers(teamId);
  const changeRole = useChangeRole(teamId);
  const remove = useRemoveMember(teamId);
  if (!members.data) return <NoDataYet query={members} what="members" />;
  return (
    <div className="space-y-2">
      {changeRole.isError && <ErrorNote error={changeRole.error} />}
      {remove.isError && <ErrorNote error={remove.error} />}
      <ScrollX label="Members table">
        <table className="w-full text-sm" aria-label="Members">
          <thead>
            <tr className="border-b border-line text-left text-xs text-ink-soft">
              <th className="py-1 pr-2 font-medium">Name</th>
              <th className="py-1 pr-2 font-medium">E-mail</th>
              <th className="py-1 pr-2 font-medium">Role</th>
              <th className="py-1 pr-2 font-medium">Joined</th>
              {canManage && <th />}
            </tr>
          </thead>
          <tbody>
            {members.data.members.map((m) => (
              <tr key={m.userId} className="border-b border-line/60">
                <td className="py-1.5 pr-2">{m.name}</td>
                <td className="py-1.5 pr-2 font-mono text-xs text-ink-soft">{m.email}</td>
                <td className="py-1.5 pr-2">
                  {canManage && m.userId !== myUserId ? (
                    <select
                      aria-label={`Role of ${m.name}`}
                      value={m.role}
                      title={roleDescriptions[m.role]}
                      disabled={changeRole.isPending}
                      onChange={(e) =>
                        changeRole.mutate({ userId: m.userId, role: e.target.value as Role })
                      }
                      className="rounded border border-line bg-paper-raised px-2 py-0.5 text-sm"
                    >
                      {RoleSchema.options.map((r) => (
                        <option key={r} value={r}>
                          {roleLabels[r]}
                        </option>
                      ))}
                    </select>
                  ) : (
                    <span title={roleDescriptions[m.role]}>{roleLabels[m.role]}</span>
                  )}
                </td>
                <td className="num py-1.5 pr-2 text-xs text-ink-faint">
                  {new Date(m.joinedAt).toLocaleDateString()}
                </td>
                {canManage && (
                  <td className="py-1.5 text-right">
                    {m.userId !== myUserId && (
                      <Button
                        size="sm"
                        tone="danger"
                        disabled={remove.isPending}
                        onClick={() => {
                          if (window.confirm(`Remove ${m.name} from the team?`))
                            remove.mutate(m.userId);
                        }}
                      >
                        Remove
                      </Button>
                    )}
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollX>
    </div>
  );
}
