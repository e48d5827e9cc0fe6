import type { DataSource } from 'typeorm';
import type { FlightSummary, ReviewState } from '../../shared/schemas/flights';
import { Aircraft } from '../aircraft/aircraft.entity';
import { User } from '../auth/user.entity';
import { NotFoundError } from '../http/errors';
import { iso } from '../util';
import { Flight } from './flight.entity';
import { severityName } from './flight-summary';

const summaryColumns = [
  'f.id AS id',
  'f.teamId AS "teamId"',
  'f.aircraftId AS "aircraftId"',
  'a.name AS "aircraftName"',
  'f.pilotId AS "pilotId"',
  'u.name AS "pilotName"',
  'f.recordedAt AS "recordedAt"',
  'f.durationS AS "durationS"',
  'f.sampleRateHz AS "sampleRateHz"',
  'f.fileName AS "fileName"',
  'f.sha256 AS sha256',
  'f.sizeBytes AS "sizeBytes"',
  'f.rawKey AS "rawKey"',
  'f.worstSeverity AS "worstSeverity"',
  'f.noteCount AS "noteCount"',
  'f.watchCount AS "watchCount"',
  'f.actCount AS "actCount"',
  'f.commentCount AS "commentCount"',
  'f.openComments AS "openComments"',
  'f.reviewState AS "reviewState"',
  'f.note AS note',
  'f.createdAt AS "createdAt"',
  'f.updatedAt AS "updatedAt"',
];

export interface SummaryRow {
  id: string;
  teamId: string;
  aircraftId: string;
  aircraftName: string;
  pilotId: string;
  pilotName: string;
  recordedAt: number;
  durationS: number;
  sampleRateHz: number;
  fileName: string;
  sha256: string;
  sizeBytes: number | null;
  rawKey: string | null;
  worstSeverity: number;
  noteCount: number;
  watchCount: number;
  actCount: number;
  commentCount: number;
  openComments: number;
  reviewState: string;
  note: string;
  createdAt: number;
  updatedAt: number;
}

export function toSummary(r: SummaryRow): FlightSummary {
  return {
    id: r.id,
    teamId: r.teamId,
    aircraftId: r.aircraftId,
    aircraftName: r.aircraftName,
    pilot: { id: r.pilotId, name: r.pilotName },
    recordedAt: iso(Number(r.recordedAt)),
    durationS: Number(r.durationS),
    sampleRateHz: Number(r.sampleRateHz),
    fileName: r.fileName,
    sha256: r.sha256,
    sizeBytes: r.sizeBytes === null ? null : Number(r.sizeBytes),
    hasRaw: r.rawKey !== null,
    worstSeverity: severityName(Number(r.worstSeverity)),
    findingCounts: {
      note: Number(r.noteCount),
      watch: Number(r.watchCount),
      act: Number(r.actCount),
    },
    commentCount: Number(r.commentCount),
    openComments: Number(r.openComments),
    reviewState: r.reviewState as ReviewState,
    note: r.note,
    createdAt: iso(Number(r.createdAt)),
    updatedAt: iso(Number(r.updatedAt)),
  };
}

/** The list row's columns for any set of flights; callers add the where clause. */
export function summaryQuery(ds: DataSource) {
  return ds
    .getRepository(Flight)
    .createQueryBuilder('f')
    .innerJoin(Aircraft, 'a', 'a.id = f.aircraftId')
    .innerJoin(User, 'u', 'u.id = f.pilotId')
    .select(summaryColumns);
}

/** One flight as a list row; 404 when it is gone. */
export async function loadSummary(ds: DataSource, id: string): Promise<FlightSummary> {
  const row = await summaryQuery(ds).where('f.id = :id', { id }).getRawOne<SummaryRow>();
  if (!row) throw new NotFoundError('Flight');
  return toSummary(row);
}
