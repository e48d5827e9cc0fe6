import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { useMe } from '../../api/session';
import {
  PasswordSettings,
  ProfileSettings,
} from '../../features/session/components/account-settings';
import { RequireSession } from '../../features/session/components/require-session';
import { roleLabels } from '../../lib/role-labels';

export function AccountRoute() {
  return (
    <RequireSession>
      <Account />
    </RequireSession>
  );
}

function Account() {
  const me = useMe().data;
  if (!me) return null;
  return (
    <>
      <PageHeader title="Account" lead={<span className="font-mono">{me.email}</span>} />
      <div className="space-y-5">
        <Panel title="Profile and e-mail">
          <ProfileSettings me={me} />
        </Panel>
        <Panel title="Password">
          <PasswordSettings />
        </Panel>
        <Panel title="Teams">
          <ul className="text-sm">
            {me.teams.map((t) => (
              <li key={t.id}>
                {t.name} · <span className="text-ink-soft">{roleLabels[t.role]}</span>
              </li>
            ))}
          </ul>
        </Panel>
      </div>
    </>
  );
}
