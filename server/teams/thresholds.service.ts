import type { DataSource } from 'typeorm';
import { resolveThresholds, type Thresholds } from '../../shared/schemas/thresholds';
import type { TeamThresholds } from '../../shared/schemas/thresholds';
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
    };
  }

  async put(userId: string, teamId: string, thresholds: Thresholds): Promise<TeamThresholds> {
    await this.teams.authorize(userId, teamId, 'thresholds.update');
    await this.ds
      .getRepository(Team)
      .update(
        { id: teamId },
        { thresholds: JSON.stringify(thresholds), thresholdsUpdatedAt: Date.now() },
      );
    return this.get(userId, teamId);
  }
}
