import { expose } from 'comlink';
import { scenarios } from '../shared/sim/scenarios';
import { simulate } from '../shared/sim/simulate';
import { writeCanonicalCsvBytes } from '../shared/sim/csv-writer';

const api = {
  /**
   * A minute of the demo quad with a weak motor as canonical CSV bytes (a Blob, so the page
   * never holds it as a string), for the "Try a sample flight" button. Synthesised here because
   * 60 000 rows take longer than a frame.
   */
  sampleFlight(scenarioName = 'weak-motor', seed = 7): { csv: Blob; fileName: string } {
    const base = scenarios[scenarioName];
    if (!base) throw new RangeError(`unknown scenario "${scenarioName}"`);
    // The sample should show a verdict at a glance: the weak motor a little weaker than the
    // library scenario's borderline case (16 % less thrust per output², about +9 % output).
    const scenario =
      scenarioName === 'weak-motor'
        ? { ...base, faults: [{ kind: 'weak-motor' as const, motor: 3, efficiency: 0.84 }] }
        : base;
    const { log } = simulate(scenario, { seconds: 60, rateHz: 1000, seed });
    const parts: BlobPart[] = [];
    for (const chunk of writeCanonicalCsvBytes(log, {
      metadata: { aircraft: 'Kite (sample)', scenario: scenarioName },
    })) {
      parts.push(chunk as Uint8Array<ArrayBuffer>);
    }
    return { csv: new Blob(parts, { type: 'text/csv' }), fileName: `sample-${scenarioName}.csv` };
  },
};

export type SampleApi = typeof api;
expose(api);
