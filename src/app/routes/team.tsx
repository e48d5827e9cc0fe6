import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { useActiveTeam } from '../../features/session/active-team';
import { useMe } from '../../api/session';
import { RequireSession } from '../../features/session/components/require-session';
import { InvitesPanel } from '../../features/team/components/invites-panel';
import { MembersTable } from '../../features/team/components/members-table';
import { PresetsList } from '../../features/team/components/presets-list';
import { TeamNameForm } from '../../features/team/components/team-name-form';
import { ThresholdsEditor } from '../../features/team/components/thresholds-editor';
import { can } from '../../../shared/auth/permissions';
import { roleLabels } from '../../lib/role-labels';
import { NoTeam } from './no-team';

export function TeamRoute() {
  return (
    <RequireSession>
      <TeamPage />
    </RequireSession>
  );
}

function TeamPage() {
  const { team } = useActiveTeam();
  const me = useMe().data;
  if (!team || !me) return <NoTeam title="Team" />;
  return (
    <>
      <PageHeader
        title="Team"
        lead={
          <>
            {team.name} · you are <strong>{roleLabels[team.role]}</strong>. Members and roles,
            invitations, import presets and the limits the verdict judges against.
          </>
        }
      />
      <div className="space-y-5">
        {can(team.role, 'team.update') && (
          <Panel title="Name">
            <TeamNameForm teamId={team.id} name={team.name} />
          </Panel>
        )}
        <Panel title="Members">
          <MembersTable
            teamId={team.id}
            canManage={can(team.role, 'members.manage')}
            myUserId={me.id}
          />
        </Panel>
        {can(team.role, 'invites.manage') && (
          <Panel title="Invitations">
            <InvitesPanel teamId={team.id} />
          </Panel>
        )}
        <Panel title="Import presets">
          <PresetsList
            teamId={team.id}
            canEdit={can(team.role, 'presets.write')}
            canDelete={can(team.role, 'presets.delete')}
          />
        </Panel>
        <Panel title="Thresholds">
          <ThresholdsEditor teamId={team.id} canEdit={can(team.role, 'thresholds.update')} />
        </Panel>
      </div>
    </>
  );
}
