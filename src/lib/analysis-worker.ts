import { wrap, type Remote } from 'comlink';
import type { AnalysisApi } from '../../workers/analysis.worker';

let remote: Remote<AnalysisApi> | undefined;

/** The one analysis worker of this tab; it keeps each analysed log (by flight id) for the filter bench. */
export const analysisWorker = () =>
  (remote ??= wrap<AnalysisApi>(
    new Worker(new URL('../../workers/analysis.worker.ts', import.meta.url), { type: 'module' }),
  ));
