import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { PresetInput, PresetPatch, type Preset as PresetDto } from '../../shared/schemas/presets';
import { User } from '../auth/user.entity';
import { ConflictError, NotFoundError } from '../http/errors';
import { VersionConflictError } from '../http/versions';
import type { TeamsService } from '../teams/teams.service';
import { iso } from '../util';
import { ImportPreset } from './preset.entity';

export class PresetsService {
  constructor(
    private readonly ds: DataSource,
    private readonly teams: TeamsService,
  ) {}

  private get repo() {
    return this.ds.getRepository(ImportPreset);
  }

  private async toDtos(rows: ImportPreset[]): Promise<PresetDto[]> {
    const ids = [...new Set(rows.map((r) => r.createdById))];
    const users = ids.length
      ? await this.ds
          .getRepository(User)
          .createQueryBuilder('u')
          .select(['u.id AS id', 'u.name AS name'])
          .where('u.id IN (:...ids)', { ids })
          .getRawMany<{ id: string; name: string }>()
      : [];
    const names = new Map(users.map((u) => [u.id, u.name]));
    return rows.map((p) => ({
      id: p.id,
      teamId: p.teamId,
      name: p.name,
      columnMap: p.columnMap,
      createdBy: { id: p.createdById, name: names.get(p.createdById) ?? 'former member' },
      createdAt: iso(p.createdAt),
      updatedAt: iso(p.updatedAt),
      version: p.version,
    }));
  }

  private async nameFree(teamId: string, name: string, exceptId?: string) {
    const clash = await this.repo.findOneBy({ teamId, name });
    if (clash && clash.id !== exceptId)
      throw new ConflictError(`A preset called "${name}" already exists.`, 'name_taken');
  }

  async list(userId: string, teamId: string): Promise<PresetDto[]> {
    await this.teams.authorize(userId, teamId, 'team.read');
    return this.toDtos(await this.repo.find({ where: { teamId }, order: { name: 'ASC' } }));
  }

  async create(userId: string, teamId: string, body: PresetInput): Promise<PresetDto> {
    await this.teams.authorize(userId, teamId, 'presets.write');
    const input = PresetInput.parse(body);
    await this.nameFree(teamId, input.name);
    const now = Date.now();
    const preset: ImportPreset = {
      id: randomUUID(),
      teamId,
      ...input,
      createdById: userId,
      createdAt: now,
      updatedAt: now,
      version: 1,
    };
    await this.repo.insert(preset);
    return (await this.toDtos([preset]))[0]!;
  }

  private async load(userId: string, id: string, action: 'presets.write' | 'presets.delete') {
    const preset = await this.repo.findOneBy({ id });
    if (!preset) throw new NotFoundError('Preset');
    await this.teams.authorize(userId, preset.teamId, action).catch((err: unknown) => {
      throw err instanceof NotFoundError ? new NotFoundError('Preset') : err;
    });
    return preset;
  }

  /** `expected`: the version the editor saw (If-Match); a newer one answers 412. */
  async update(
    userId: string,
    id: string,
    body: PresetPatch,
    expected?: number,
  ): Promise<PresetDto> {
    const preset = await this.load(userId, id, 'presets.write');
    if (expected !== undefined && expected !== preset.version)
      throw new VersionConflictError(preset.version, 'This preset');
    const patch = PresetPatch.parse(body);
    if (patch.name) await this.nameFree(preset.teamId, patch.name, id);
    const next = { ...preset, ...patch, updatedAt: Date.now(), version: preset.version + 1 };
    const done = await this.repo.update(
      { id, version: preset.version },
      {
        name: next.name,
        columnMap: next.columnMap,
        updatedAt: next.updatedAt,
        version: next.version,
      },
    );
    if (!done.affected) {
      const now = await this.repo.findOneByOrFail({ id });
      if (expected !== undefined) throw new VersionConflictError(now.version, 'This preset');
      return this.update(userId, id, body);
    }
    return (await this.toDtos([next]))[0]!;
  }

  async remove(userId: string, id: string): Promise<void> {
    await this.load(userId, id, 'presets.delete');
    await this.repo.delete({ id });
  }
}
