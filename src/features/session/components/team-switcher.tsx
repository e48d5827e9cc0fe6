import { Link } from 'react-router-dom';
import { roleLabels } from '../../../lib/role-labels';
import { useActiveTeam } from '../active-team';

/** Which team the fleet and team pages show; a user can fly for several with different roles. */
export function TeamSwitcher() {
  const { team, teams, select } = useActiveTeam();
  if (teams.length === 0)
    return (
      <Link to="/teams/new" className="text-xs text-accent-ink underline">
        Create a team
      </Link>
    );
  return (
    <label className="flex items-center gap-2 text-xs text-ink-soft">
      <span className="sr-only">Team</span>
      <select
        aria-label="Team"
        value={team?.id}
        onChange={(e) => select(e.target.value)}
        className="max-w-48 rounded border border-line-strong bg-paper-raised px-2 py-1 text-xs text-ink"
      >
        {teams.map((t) => (
          <option key={t.id} value={t.id}>
            {t.name} · {roleLabels[t.role]}
          </option>
        ))}
      </select>
    </label>
  );
}
