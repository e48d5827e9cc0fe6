import { z } from 'zod';
import { FlightReport, Severity } from './report';
import type { ReviewDetail } from '../analysis/review-detail';
import { Id, IsoDateTime, UserRef } from './common';

/** Upper bound for the stored review detail (downsampled traces, spectra), as JSON. */
export const MAX_DETAIL_BYTES = 6 * 1024 * 1024;

const isRecord = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * The review detail is produced by our own analysis engine and only drawn, never computed on,
 * so it is checked for shape at the top and bounded in size rather than validated point by point.
 */
export const ReviewDetailLoose = z.custom<ReviewDetail>(
  (v) =>
    isRecord(v) &&
    isRecord(v.effort) &&
    Array.isArray(v.effort.t) &&
    isRecord(v.effort.series) &&
    isRecord(v.spectra) &&
    isRecord(v.diagnosis) &&
    JSON.stringify(v).length <= MAX_DETAIL_BYTES,
  {
    message: `expected review detail (effort, spectra, diagnosis) of at most ${MAX_DETAIL_BYTES / 1048576} MB`,
  },
);

export const Sha256 = z.string().regex(/^[0-9a-f]{64}$/, 'expected a lowercase hex SHA-256');

export const ReviewState = z.enum(['none', 'requested', 'reviewed', 'changes-requested']);
export type ReviewState = z.infer<typeof ReviewState>;

/** `PUT /api/flights/:id` — the id is the client's UUID, so a retried upload stores one flight. */
export const FlightPutInput = z.object({
  teamId: Id,
  aircraftId: Id,
  recordedAt: IsoDateTime,
  fileName: z.string().trim().min(1).max(255),
  /** SHA-256 of the file exactly as dropped (the .gz bytes for a gzipped log). */
  sha256: Sha256,
  sizeBytes: z.number().int().nonnegative().optional(),
  report: FlightReport,
  detail: ReviewDetailLoose.optional(),
  note: z.string().trim().max(4000).optional(),
});
export type FlightPutInput = z.infer<typeof FlightPutInput>;

export const FindingCounts = z.object({
  note: z.number().int(),
  watch: z.number().int(),
  act: z.number().int(),
});

/** A flight in lists: no report or detail. */
export const FlightSummary = z.object({
  id: Id,
  teamId: Id,
  aircraftId: Id,
  aircraftName: z.string(),
  pilot: UserRef,
  recordedAt: IsoDateTime,
  durationS: z.number(),
  sampleRateHz: z.number(),
  fileName: z.string(),
  sha256: Sha256,
  sizeBytes: z.number().int().nullable(),
  hasRaw: z.boolean(),
  worstSeverity: Severity.nullable(),
  findingCounts: FindingCounts,
  commentCount: z.number().int(),
  /** Unresolved comment threads. */
  openComments: z.number().int(),
  reviewState: ReviewState,
  note: z.string(),
  createdAt: IsoDateTime,
  updatedAt: IsoDateTime,
});
export type FlightSummary = z.infer<typeof FlightSummary>;

export const FlightDetail = FlightSummary.extend({
  report: FlightReport,
  detail: ReviewDetailLoose.nullable(),
});
export type FlightDetail = z.infer<typeof FlightDetail>;

export const FlightPutResponse = z.object({
  /** `duplicate`: the same raw file is already stored as another flight, which is returned. */
  outcome: z.enum(['created', 'replaced', 'unchanged', 'duplicate']),
  flight: FlightSummary,
});
export type FlightPutResponse = z.infer<typeof FlightPutResponse>;

const boolParam = z.enum(['true', 'false']).transform((v) => v === 'true');

/** `GET /api/teams/:teamId/flights` query; newest first. */
export const FlightListQuery = z.object({
  aircraftId: Id.optional(),
  pilotId: Id.optional(),
  from: IsoDateTime.optional(),
  to: IsoDateTime.optional(),
  /** true: only flights with unresolved threads; false: only those without. */
  openComments: boolParam.optional(),
  /** Flights whose worst finding is at least this severe. */
  severity: Severity.optional(),
  review: ReviewState.optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  cursor: z.string().max(200).optional(),
});
export type FlightListQuery = z.infer<typeof FlightListQuery>;
/** The query as the client writes it (strings, limit optional). */
export type FlightListQueryInput = z.input<typeof FlightListQuery>;

export const FlightPage = z.object({
  flights: z.array(FlightSummary),
  /** Pass as `cursor` for the next page; null on the last page. */
  nextCursor: z.string().nullable(),
});
export type FlightPage = z.infer<typeof FlightPage>;

/** A pilot asks team members (usually a coach) to review a flight. */
export const ReviewRequestInput = z.object({
  userIds: z.array(Id).min(1).max(20),
  note: z.string().trim().max(2000).optional(),
});
export type ReviewRequestInput = z.infer<typeof ReviewRequestInput>;

/** A coach (or the owner) closes a review. */
export const ReviewStateInput = z.object({
  state: z.enum(['reviewed', 'changes-requested']),
  note: z.string().trim().max(2000).optional(),
});
export type ReviewStateInput = z.infer<typeof ReviewStateInput>;

export const RawUploadResponse = z.object({
  sha256: Sha256,
  sizeBytes: z.number().int(),
  gzip: z.boolean(),
  /** False when the same bytes were already stored. */
  stored: z.boolean(),
});
export type RawUploadResponse = z.infer<typeof RawUploadResponse>;
