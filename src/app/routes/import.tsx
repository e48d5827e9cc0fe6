import { useNavigate } from 'react-router-dom';
import { PageHeader } from '../../components/ui/page-header';
import { ImportPanel } from '../../features/import/components/import-panel';
import { useActiveTeam } from '../../features/session/active-team';

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
        canSavePreset={team?.role === 'owner' || team?.role === 'tuner' || team?.role === 'pilot'}
        onOpenFlight={(id) => navigate(`/flights/${id}`)}
      />
    </>
  );
}
