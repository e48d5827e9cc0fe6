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
    const scenario = scenarios[scenarioName];
    if (!scenario) throw new RangeError(`unknown scenario "${scenarioName}"`);
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
