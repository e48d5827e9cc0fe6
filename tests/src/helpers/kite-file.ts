import { scenarios } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';
import { writeCanonicalCsvBytes } from '../../../shared/sim/csv-writer';

/** A synthesised weak-motor flight of Kite at 1 kHz as a dropped file (demo data). */
export function kiteFile(seconds: number): Blob {
  const { log } = simulate(scenarios['weak-motor']!, { seconds, rateHz: 1000, seed: 3 });
  const parts: BlobPart[] = [];
  for (const chunk of writeCanonicalCsvBytes(log, { metadata: { aircraft: 'Kite' } }))
    parts.push(new Uint8Array(chunk));
  return new Blob(parts);
}
