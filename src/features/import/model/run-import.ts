import type { Airframe } from '../../../../shared/schemas/airframe';
import type { ColumnMap } from '../../../../shared/log/column-map';
import { severityRank, type Severity } from '../../../../shared/schemas/report';
import type { ReviewDetail } from '../../../../shared/analysis/review-detail';
import {
  collectDetail,
  columnMapNeeded,
  forgetAnalysed,
  readAndAnalyse,
} from '../../../lib/log-pipeline/pipeline';
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
  let handed;
  try {
    handed = await readAndAnalyse({
      jobId,
      flightId,
      file,
      options,
      analyse: target.airframe ? { airframe: target.airframe } : {},
      onProgress: (p) => {
        if (!isCancelled()) onStatus({ kind: 'reading', bytes: p.bytes, rows: p.rows });
      },
    });
  } catch (e) {
    if (isCancelled()) return { kind: 'cancelled' };
    return failed('worker', e);
  }
  const { read: result, received: analysing } = handed;
  if (!result.ok) {
    const { error } = result;
    if (error.code === 'cancelled' || isCancelled()) return { kind: 'cancelled' };
    if (error.code === 'needs-column-map') return columnMapNeeded(file, error);
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
    void forgetAnalysed(flightId);
    return { kind: 'cancelled' };
  }
  const { report, head } = analysed;
  let detail: ReviewDetail;
  try {
    // One part per message, so no single task on this thread reads the whole detail.
    detail = await collectDetail(flightId, head);
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
