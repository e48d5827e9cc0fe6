import { rm } from 'node:fs/promises';
import type { DataSource } from 'typeorm';
import type { RawUploadResponse } from '../../shared/schemas/flights';
import { canOnRecord } from '../../shared/auth/permissions';
import { AppError, ConflictError, ForbiddenError, NotFoundError } from '../http/errors';
import { Flight } from './flight.entity';
import type { FlightsService } from './flights.service';
import { rawKey, type RawStore } from './raw-store';
import { notCsvReason, type StagedFile } from './raw-upload';

/** The raw CSV log behind each flight: attached after the record, kept per team by hash. */
export class RawLogsService {
  constructor(
    private readonly ds: DataSource,
    private readonly flights: FlightsService,
    readonly rawStore: RawStore,
  ) {}

  private get repo() {
    return this.ds.getRepository(Flight);
  }

  /** Removes a stored raw log once no flight refers to it (keys are per team). */
  async release(key: string) {
    const users = await this.repo.countBy({ rawKey: key });
    if (users === 0) await this.rawStore.remove(key);
  }

  /**
   * Startup sweep: removes stored raw logs no flight refers to (left by a crash between a
   * delete and its file removal, or by older versions) and staged uploads nobody finished.
   */
  async sweep(): Promise<number> {
    await this.rawStore.clearStaging();
    const rows = await this.repo
      .createQueryBuilder('f')
      .select('DISTINCT f.rawKey', 'rawKey')
      .where('f.rawKey IS NOT NULL')
      .getRawMany<{ rawKey: string }>();
    const used = new Set(rows.map((r) => r.rawKey));
    let removed = 0;
    for await (const key of this.rawStore.keys()) {
      if (used.has(key)) continue;
      await this.rawStore.remove(key);
      removed++;
    }
    return removed;
  }

  /** Checks the staged upload against the flight and keeps it; removes it on any refusal. */
  async attach(userId: string, id: string, staged: StagedFile): Promise<RawUploadResponse> {
    try {
      const f = await this.flights.access(userId, id, 'flights.upload');
      if (!canOnRecord(f.role, 'flights.replaceAny', 'flights.upload', f.pilotId === userId)) {
        throw new ForbiddenError(
          'Only the pilot who uploaded this flight, or the team owner, can attach its log.',
        );
      }
      const reason = await notCsvReason(staged);
      if (reason)
        throw new AppError(
          415,
          'not_csv',
          `${reason} Send the flight controller's CSV log (.csv or .csv.gz).`,
        );
      const flight = await this.repo.findOneOrFail({
        where: { id },
        select: { id: true, sha256: true, rawKey: true },
      });
      if (flight.sha256 !== staged.sha256) {
        throw new ConflictError(
          'This file is not the one the flight was analysed from (SHA-256 differs).',
          'hash_mismatch',
        );
      }
      const key = rawKey(f.teamId, staged.sha256, staged.gzip);
      const { stored } = await this.rawStore.put(staged.path, key);
      await this.repo.update({ id }, { rawKey: key, rawGzip: staged.gzip, sizeBytes: staged.size });
      return { sha256: staged.sha256, sizeBytes: staged.size, gzip: staged.gzip, stored };
    } finally {
      // put() moved it on success; anything left is refused input.
      await rm(staged.path, { force: true });
    }
  }

  async open(userId: string, id: string) {
    await this.flights.access(userId, id, 'team.read');
    const f = await this.repo.findOneOrFail({
      where: { id },
      select: { id: true, rawKey: true, rawGzip: true, fileName: true },
    });
    if (!f.rawKey) throw new NotFoundError('The raw log of this flight');
    const { stream, size } = await this.rawStore.open(f.rawKey);
    return { stream, size, gzip: f.rawGzip, fileName: f.fileName };
  }
}
