import { useNavigate } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { ImportPanel } from '../../features/import/components/import-panel';
import { useActiveTeam } from '../../features/session/active-team';
import { can } from '../../../shared/auth/permissions';

export function ImportRoute() {
  const navigate = useNavigate();
  const { team } = useActiveTeam();
  return (
    <>
      <PageHeader
        title="Import"
        lead="Drop flight-controller CSV logs; they are read and analysed on this device, even offline, and the review opens as soon as the verdict is ready."
      />
      <ImportPanel
        teamId={team?.id ?? null}
        canSavePreset={can(team?.role, 'presets.write')}
        onOpenFlight={(id) => navigate(`/flights/${id}`)}
      />
    </>
  );
}
