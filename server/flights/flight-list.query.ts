import type { DataSource } from 'typeorm';
import type { FlightListQuery, FlightPage } from '../../shared/schemas/flights';
import { cachedQuery } from '../db/sql';
import { BadRequestError } from '../http/errors';
import { severityRank } from './flight-summary';
import { summaryQuery, toSummary, type SummaryRow } from './flight-rows';

const encodeCursor = (recordedAt: number, id: string) =>
  Buffer.from(JSON.stringify([recordedAt, id])).toString('base64url');

function decodeCursor(cursor: string): [number, string] {
  try {
    const v = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')) as unknown;
    if (Array.isArray(v) && typeof v[0] === 'number' && typeof v[1] === 'string')
      return [v[0], v[1]];
  } catch {
    // fall through
  }
  throw new BadRequestError('The page cursor is not one this server gave out.');
}

/** A team's flight list, newest first, filtered and paged by an opaque cursor. */
export class FlightListQueries {
  constructor(private readonly ds: DataSource) {}

  /** One cached SQL text per combination of filters (and page size) a client uses. */
  private readonly listQueries = new Map<
    string,
    (p: Record<string, string | number>) => Promise<SummaryRow[]>
  >();

  async page(teamId: string, q: FlightListQuery): Promise<FlightPage> {
    const params: Record<string, string | number> = { teamId };
    if (q.aircraftId) params.aircraftId = q.aircraftId;
    if (q.pilotId) params.pilotId = q.pilotId;
    if (q.from) params.from = Date.parse(q.from);
    if (q.to) params.to = Date.parse(q.to);
    if (q.review) params.review = q.review;
    if (q.cursor) [params.cr, params.cid] = decodeCursor(q.cursor);
    // The severity rank (one of three) is written into the SQL, not bound: a literal matches the
    // partial indexes for "watch or worse" and "act" in every build (sqlite.org/partialindex.html
    // §2); a bound value is matched only by builds with STAT4, and only after a re-prepare.
    const sev = q.severity ? severityRank(q.severity) : 0;
    const key = `${Object.keys(params).join(',')}|open=${String(q.openComments)}|sev=${sev}|limit=${q.limit}`;
    let run = this.listQueries.get(key);
    if (!run) {
      if (this.listQueries.size > 500) this.listQueries.clear();
      run = cachedQuery<Record<string, string | number>, SummaryRow>(this.ds, (p) => {
        const qb = summaryQuery(this.ds).where('f.teamId = :teamId', { teamId: p.teamId });
        if ('aircraftId' in p)
          qb.andWhere('f.aircraftId = :aircraftId', { aircraftId: p.aircraftId });
        if ('pilotId' in p) qb.andWhere('f.pilotId = :pilotId', { pilotId: p.pilotId });
        if ('from' in p) qb.andWhere('f.recordedAt >= :from', { from: p.from });
        if ('to' in p) qb.andWhere('f.recordedAt < :to', { to: p.to });
        if (q.openComments !== undefined)
          qb.andWhere(q.openComments ? 'f.openComments > 0' : 'f.openComments = 0');
        if (sev > 0) qb.andWhere(`f.worstSeverity >= ${sev}`);
        if ('review' in p) qb.andWhere('f.reviewState = :review', { review: p.review });
        // A row-value comparison seeks straight to the cursor in the (…, recordedAt, id) index;
        // the equivalent OR of two terms walked every newer flight first, so deep pages cost
        // more the further down the list they were.
        if ('cr' in p) {
          qb.andWhere('(f.recordedAt, f.id) < (:cr, :cid)', { cr: p.cr, cid: p.cid });
        }
        return qb
          .orderBy('f.recordedAt', 'DESC')
          .addOrderBy('f.id', 'DESC')
          .limit(q.limit + 1);
      });
      this.listQueries.set(key, run);
    }
    const rows = await run(params);
    const more = rows.length > q.limit;
    const page = rows.slice(0, q.limit);
    const last = page[page.length - 1];
    return {
      flights: page.map(toSummary),
      nextCursor: more && last ? encodeCursor(Number(last.recordedAt), last.id) : null,
    };
  }
}
