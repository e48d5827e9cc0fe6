import { wrap, type Remote } from 'comlink';
import type { AnalysisApi, ParseApi, SampleApi } from '../../../workers/protocol';

/**
 * The three workers of this tab, each created on first use: the log reader, the analysis (it
 * keeps each analysed log, by flight id, for the filter bench) and the sample-flight synthesiser.
 */
let parse: Remote<ParseApi> | undefined;
let analysis: Remote<AnalysisApi> | undefined;
let sample: Remote<SampleApi> | undefined;

export const parseWorker = () =>
  (parse ??= wrap<ParseApi>(
    new Worker(new URL('../../../workers/parse.worker.ts', import.meta.url), { type: 'module' }),
  ));

export const analysisWorker = () =>
  (analysis ??= wrap<AnalysisApi>(
    new Worker(new URL('../../../workers/analysis.worker.ts', import.meta.url), {
      type: 'module',
    }),
  ));

export const sampleWorker = () =>
  (sample ??= wrap<SampleApi>(
    new Worker(new URL('../../../workers/sample.worker.ts', import.meta.url), { type: 'module' }),
  ));
