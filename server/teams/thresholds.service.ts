import type { DataSource } from 'typeorm';
import { resolveThresholds, type Thresholds } from '../../shared/schemas/thresholds';
import type { TeamThresholds } from '../../shared/schemas/thresholds';
import { VersionConflictError } from '../http/versions';
import { isoOrNull } from '../util';
import { Team } from './team.entity';
import type { TeamsService } from './teams.service';

/** Team analysis thresholds, stored as validated JSON on the team. */
export class ThresholdsService {
  constructor(
    private readonly ds: DataSource,
    private readonly teams: TeamsService,
  ) {}

  async get(userId: string, teamId: string): Promise<TeamThresholds> {
    await this.teams.authorize(userId, teamId, 'team.read');
    const team = await this.ds.getRepository(Team).findOneByOrFail({ id: teamId });
    const stored =
      team.thresholds === null ? undefined : (JSON.parse(team.thresholds) as Partial<Thresholds>);
    return {
      // Settings saved before a threshold existed pick up its default.
      thresholds: resolveThresholds(stored),
      isDefault: stored === undefined,
      updatedAt: isoOrNull(team.thresholdsUpdatedAt),
      version: team.thresholdsVersion,
    };
  }

  /** `expected`: the version the editor saw (If-Match); a newer one answers 412. */
  async put(
    userId: string,
    teamId: string,
    thresholds: Thresholds,
    expected?: number,
  ): Promise<TeamThresholds> {
    await this.teams.authorize(userId, teamId, 'thresholds.update');
    const teams = this.ds.getRepository(Team);
    const { thresholdsVersion: current } = await teams.findOneByOrFail({ id: teamId });
    if (expected !== undefined && expected !== current)
      throw new VersionConflictError(current, "The team's thresholds");
    const done = await teams.update(
      { id: teamId, thresholdsVersion: current },
      {
        thresholds: JSON.stringify(thresholds),
        thresholdsUpdatedAt: Date.now(),
        thresholdsVersion: current + 1,
      },
    );
    if (!done.affected) {
      const now = await teams.findOneByOrFail({ id: teamId });
      if (expected !== undefined)
        throw new VersionConflictError(now.thresholdsVersion, "The team's thresholds");
      return this.put(userId, teamId, thresholds);
    }
    return this.get(userId, teamId);
  }
}
