import { wrap, type Remote } from 'comlink';
import type { ParseApi } from '../../workers/parse.worker';

let remote: Remote<ParseApi> | undefined;

/** The one parse worker of this tab, created on first use; it runs several jobs by id. */
export const parseWorker = () =>
  (remote ??= wrap<ParseApi>(
    new Worker(new URL('../../workers/parse.worker.ts', import.meta.url), { type: 'module' }),
  ));
