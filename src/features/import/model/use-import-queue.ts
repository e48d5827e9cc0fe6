import { useCallback, useEffect, useReducer, useRef } from 'react';
import type { Aircraft } from '../../../../shared/schemas/aircraft';
import { mapCoveringHeaders } from '../../../../shared/log/column-map';
import type { Preset } from '../../../../shared/schemas/presets';
import { cancelRead, columnMapNeeded } from '../../../lib/log-pipeline/pipeline';
import { jobsReducer, nextQueued, type ImportJob } from './import-jobs';
import { runImport } from './run-import';

/**
 * The import queue: files dropped are read and analysed one at a time, each job's status kept
 * for its row; a job that needs a column map takes a team preset covering its headers without
 * asking, and a single dropped file opens its review when done.
 */
export function useImportQueue(options: {
  teamId: string | null;
  aircraft: Aircraft | null;
  presets: Preset[] | undefined;
  onOpenFlight: (flightId: string) => void;
}) {
  const { teamId, aircraft, presets, onOpenFlight } = options;
  const [jobs, dispatch] = useReducer(jobsReducer, []);
  const cancelled = useRef(new Set<string>());
  const single = useRef<string | null>(null);

  const addFiles = useCallback((files: File[]) => {
    const items = files.map((file) => ({ id: crypto.randomUUID(), file }));
    dispatch({ type: 'add', items });
    // A single file opens its review when done; from a batch the pilot picks.
    single.current = items.length === 1 ? items[0]!.id : null;
  }, []);

  // Run queued jobs one at a time.
  const next = nextQueued(jobs);
  useEffect(() => {
    if (!next) return;
    const job: ImportJob = next;
    cancelled.current.delete(job.id);
    // The review's charts come next: load their code while the workers read the log, when
    // this thread is idle, rather than in the review's first paint.
    void import('../../../components/charts/echarts');
    void runImport({
      jobId: job.id,
      file: job.file,
      ...(job.columnMap ? { columnMap: job.columnMap } : {}),
      ...(job.poles !== undefined ? { poles: job.poles } : {}),
      target: {
        ...(aircraft ? { airframe: aircraft.airframe } : {}),
        ...(teamId ? { teamId } : {}),
        ...(aircraft ? { aircraftId: aircraft.id } : {}),
      },
      onStatus: (status) => dispatch({ type: 'status', id: job.id, status }),
      isCancelled: () => cancelled.current.has(job.id),
    }).then((status) => {
      dispatch({ type: 'status', id: job.id, status });
      if (status.kind === 'needs-map') {
        const preset = mapCoveringHeaders(presets, status.headers);
        // A team preset that covers every header is applied without asking again.
        if (preset && !job.columnMap) dispatch({ type: 'map', id: job.id, columnMap: preset });
      }
      if (status.kind === 'done' && single.current === job.id) onOpenFlight(status.flightId);
    });
    // `next` changes identity on every status update; only a new job id should start work.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [next?.id, next?.status.kind]);

  const cancel = (id: string) => {
    cancelled.current.add(id);
    void cancelRead(id);
    dispatch({ type: 'status', id, status: { kind: 'cancelled' } });
  };

  const openMap = async (job: ImportJob) => {
    try {
      dispatch({ type: 'status', id: job.id, status: await columnMapNeeded(job.file) });
    } catch (e) {
      dispatch({
        type: 'status',
        id: job.id,
        status: {
          kind: 'failed',
          canMap: false,
          problem: { code: 'header', message: e instanceof Error ? e.message : String(e) },
        },
      });
    }
  };

  return { jobs, dispatch, addFiles, cancel, openMap };
}
