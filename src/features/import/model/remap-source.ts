import type { HeaderPreview } from '../../../../shared/log/header';
import { fetchRawLog } from '../../../api/flights';
import { getLocalFlight } from '../../../lib/local-db';
import { inspectFile } from '../../../lib/log-pipeline/pipeline';

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
    file = await fetchRawLog(flightId);
    fileName = 'the stored log';
  }
  return { flightId, fileName, preview: await inspectFile(file) };
}
