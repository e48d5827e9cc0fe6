import type { HeaderPreview } from '../../../../shared/log/header';
import { pathTo } from '../../../../shared/api/paths';
import { getLocalFlight } from '../../../lib/local-db';
import { parseWorker } from '../../../lib/parse-worker';

/** A kept flight's raw log and the start of it, for mapping its columns once more. */
export interface RemapSource {
  flightId: string;
  fileName: string;
  preview: HeaderPreview;
}

/**
 * The raw log of a flight (this device first, else the team server) and its header preview,
 * for the column-map step that lets the review's filter bench read it again.
 */
export async function loadRemapSource(flightId: string): Promise<RemapSource> {
  const local = await getLocalFlight(flightId).catch(() => undefined);
  let file: Blob;
  let fileName: string;
  if (local) {
    file = local.file;
    fileName = local.fileName;
  } else {
    const res = await fetch(pathTo('flightRaw', { id: flightId }), { credentials: 'same-origin' });
    if (!res.ok)
      throw new Error(
        res.status === 404
          ? 'The raw log of this flight is not on this device or on the team server.'
          : `The raw log could not be fetched (HTTP ${res.status}); try again when online and signed in.`,
      );
    file = await res.blob();
    fileName = 'the stored log';
  }
  const answer = await parseWorker().inspectHeader(file);
  if (!answer.ok) throw new Error(`The header itself cannot be read: ${answer.error.message}`);
  return { flightId, fileName, preview: answer.preview };
}
