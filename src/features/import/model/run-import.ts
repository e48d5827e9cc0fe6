import { proxy, transfer } from 'comlink';
import type { Airframe } from '../../../../shared/schemas/airframe';
import type { ColumnMap } from '../../../../shared/log/column-map';
import { severityRank, type Severity } from '../../../../shared/schemas/report';
import {
  DETAIL_PARTS,
  type DetailParts,
  type ReviewDetail,
} from '../../../../shared/analysis/review-detail';
import { parseWorker } from '../../../lib/parse-worker';
import { analysisWorker } from '../../../lib/analysis-worker';
import { saveLocalFlight } from '../../../lib/local-db';
import type { JobStatus } from './import-jobs';

export interface ImportTarget {
  /** The aircraft's airframe; without one the engine assumes a quad X and says so in the report. */
  airframe?: Airframe;
  teamId?: string;
  aircraftId?: string;
}

export interface ImportRequest {
  jobId: string;
  file: Blob;
  /** Name to keep with the flight (a Blob from storage has none of its own). */
  fileName?: string;
  /** Re-analyse an existing flight under its own id (e.g. once its aircraft is known). */
  flightId?: string;
  columnMap?: ColumnMap;
  poles?: number;
  target: ImportTarget;
  onStatus: (status: JobStatus) => void;
  /** Checked after each stage: a cancelled job stores nothing. */
  isCancelled: () => boolean;
}

/** Progress reports arrive from the worker at most ten times a second. */
export interface ParseProgress {
  bytes: number;
  rows: number;
}

/**
 * One file through the same path every import takes: read in the parse worker, analysed in the
 * analysis worker, kept on this device (IndexedDB) for the sync to send later. The review can
 * open as soon as this resolves with `done`; no network is involved.
 */
export async function runImport(req: ImportRequest): Promise<JobStatus> {
  const { jobId, file, target, onStatus, isCancelled } = req;
  onStatus({ kind: 'reading', bytes: 0, rows: 0 });
  const options: { columnMap?: ColumnMap; poles?: number } = {};
  if (req.columnMap) options.columnMap = req.columnMap;
  const poles = req.poles ?? target.airframe?.poles;
  if (poles !== undefined) options.poles = poles;

  const flightId = req.flightId ?? crypto.randomUUID();
  // The parse worker hands the columns straight to the analysis worker over this channel; the
  // page only ever sees the summary and the (small) analysis.
  const channel = new MessageChannel();
  const analysing = analysisWorker().analyzeDelivered(
    flightId,
    transfer(channel.port2, [channel.port2]),
    target.airframe ? { airframe: target.airframe } : {},
  );
  // Handled below once the read is known to have worked; a failed read rejects this on purpose.
  analysing.catch(() => undefined);

  let result;
  try {
    result = await parseWorker().parseInto(
      jobId,
      file,
      options,
      transfer(channel.port1, [channel.port1]),
      proxy((p: ParseProgress) => {
        if (!isCancelled()) onStatus({ kind: 'reading', bytes: p.bytes, rows: p.rows });
      }),
    );
  } catch (e) {
    if (isCancelled()) return { kind: 'cancelled' };
    return failed('worker', e);
  }
  if (!result.ok) {
    const { error } = result;
    if (error.code === 'cancelled' || isCancelled()) return { kind: 'cancelled' };
    if (error.code === 'needs-column-map') {
      const answer = await parseWorker()
        .inspectHeader(file)
        .catch(() => null);
      const inspected = answer?.ok ? answer.preview : null;
      return {
        kind: 'needs-map',
        headers: error.headers ?? inspected?.headers ?? [],
        // The preview's proposal has seen the first rows, so it also offers units from values.
        proposal: inspected?.proposal ??
          error.proposal ?? { entries: [], missing: ['time', 'motor1'] },
        sampleRows: inspected?.sampleRows ?? [],
      };
    }
    return {
      kind: 'failed',
      canMap:
        error.line !== undefined || error.code.includes('channel') || error.code.includes('unit'),
      problem: {
        code: error.code,
        message: error.message,
        ...(error.line !== undefined ? { line: error.line } : {}),
        ...(error.column !== undefined ? { column: error.column } : {}),
        ...(error.header !== undefined ? { header: error.header } : {}),
      },
    };
  }

  const summary = result.summary;
  onStatus({ kind: 'analysing', rows: summary.rows });
  let analysed;
  try {
    analysed = await analysing;
  } catch (e) {
    return failed('analysis', e);
  }
  if (isCancelled()) {
    void analysisWorker().forget(flightId);
    return { kind: 'cancelled' };
  }
  const { report, head } = analysed;
  let detail: ReviewDetail;
  try {
    // One part per message, so no single task on this thread reads the whole detail.
    const parts: Partial<DetailParts> = {};
    for (const key of DETAIL_PARTS)
      Object.assign(parts, await analysisWorker().detailPart(flightId, key));
    detail = { ...head, ...completeParts(parts) };
  } catch (e) {
    return failed('analysis', e);
  }
  try {
    await saveLocalFlight({
      id: flightId,
      fileName: req.fileName ?? (file instanceof File ? file.name : 'flight.csv'),
      file,
      // Kept so the log can be read again the same way (filter bench after a reload).
      ...(options.columnMap ? { columnMap: options.columnMap } : {}),
      ...(options.poles !== undefined ? { poles: options.poles } : {}),
      report,
      detail,
      ...(target.teamId ? { teamId: target.teamId } : {}),
      ...(target.aircraftId ? { aircraftId: target.aircraftId } : {}),
      ...(summary.metadata['recorded'] ? { recordedAt: summary.metadata['recorded'] } : {}),
    });
  } catch (e) {
    return failed('storage', e);
  }
  let worst: Severity | null = null;
  for (const f of report.findings)
    if (worst === null || severityRank(f.severity) > severityRank(worst)) worst = f.severity;
  return { kind: 'done', flightId, findings: report.findings.length, worst };
}

function completeParts(parts: Partial<DetailParts>): DetailParts {
  const missing = DETAIL_PARTS.filter((k) => !(k in parts));
  if (missing.length > 0) throw new Error(`the analysis sent no ${missing.join(', ')}`);
  return parts as DetailParts;
}

function failed(stage: 'worker' | 'analysis' | 'storage', e: unknown): JobStatus {
  const message = e instanceof Error ? e.message : String(e);
  const lead =
    stage === 'analysis'
      ? 'The log was read, but the analysis stopped: '
      : stage === 'storage'
        ? 'The flight could not be kept on this device (storage full or private mode?): '
        : 'The log reader stopped unexpectedly: ';
  return { kind: 'failed', canMap: false, problem: { code: stage, message: lead + message } };
}
