import { wrap, type Remote } from 'comlink';
import type { SampleApi } from '../../../../workers/sample.worker';

let remote: Remote<SampleApi> | undefined;
const sampleWorker = () =>
  (remote ??= wrap<SampleApi>(
    new Worker(new URL('../../../../workers/sample.worker.ts', import.meta.url), {
      type: 'module',
    }),
  ));

/**
 * A synthesised flight of our demo quad with a weak motor, written as a canonical CSV in a
 * worker, so a first-time pilot sees a full review without a log of their own. It goes through
 * the same import path as a dropped file.
 */
export async function synthesiseSampleFile(): Promise<File> {
  const { csv, fileName } = await sampleWorker().sampleFlight();
  return new File([csv], fileName, { type: 'text/csv' });
}
