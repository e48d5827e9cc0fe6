/**
 * Synthesises the 300 s, 4 kHz, 4-motor flight the parse and analysis benchmarks read, and
 * reports how fast: seconds of flight per second of compute (real-time ratio) and CSV MB/s,
 * with a naive toFixed writer on the same rows as the in-run reference.
 */
import {
  closeSync,
  existsSync,
  openSync,
  renameSync,
  statSync,
  writeFileSync,
  writeSync,
} from 'node:fs';
import { join } from 'node:path';
import { writeCanonicalCsvBytes } from '../../shared/sim/csv-writer';
import { scenarios } from '../../shared/sim/scenarios';
import { simulate } from '../../shared/sim/simulate';
import type { Bench } from './registry';

const SECONDS = 300;
const RATE_HZ = 4000;
const REFERENCE_ROWS = 100_000;

const bench: Bench = async ({ json, dir }) => {
  const scenario = scenarios['clean-quad-x']!;
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const { log, truth } = simulate(scenario, { seconds: SECONDS, rateHz: RATE_HZ, seed: 1 });
  const synthMs = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  // CPU time too: on a shared machine wall time includes waiting for a core.
  const synthCpuMs = (cpu.user + cpu.system) / 1000;

  // Pass 1: format everything (timed) to learn the size.
  const t1 = performance.now();
  let bytes = 0;
  for (const chunk of writeCanonicalCsvBytes(log)) bytes += chunk.length;
  const csvMs = performance.now() - t1;

  // Reference: the obvious writer (toFixed per value, join per row) on the first rows.
  const names = log.channels;
  const t2 = performance.now();
  let refBytes = 0;
  for (let r = 0; r < REFERENCE_ROWS; r++) {
    refBytes += names.map((c) => log.columns[c]![r]!.toFixed(4)).join(',').length + 1;
  }
  const refMs = performance.now() - t2;

  const file = join(dir, 'flight-300s-4khz.csv');
  let written = 0;
  if (!(existsSync(file) && statSync(file).size === bytes)) {
    const tmp = `${file}.tmp-${process.pid}`;
    const fd = openSync(tmp, 'w');
    try {
      for (const chunk of writeCanonicalCsvBytes(log)) writeSync(fd, chunk);
    } finally {
      closeSync(fd);
    }
    renameSync(tmp, file);
    written = 1;
  }
  writeFileSync(join(dir, 'flight-300s-4khz.truth.json'), JSON.stringify(truth, null, 2) + '\n');

  const csvMB = bytes / 1e6;
  const figures = {
    rows: log.rows,
    synthMs: Math.round(synthMs),
    synthCpuMs: Math.round(synthCpuMs),
    flightSecondsPerSecond: +(SECONDS / (synthMs / 1000)).toFixed(1),
    csvMs: Math.round(csvMs),
    csvMB: +csvMB.toFixed(1),
    csvMBps: +(csvMB / (csvMs / 1000)).toFixed(1),
    toFixedMBps: +(refBytes / 1e6 / (refMs / 1000)).toFixed(1),
    csvVsToFixed: +(csvMB / (csvMs / 1000) / (refBytes / 1e6 / (refMs / 1000))).toFixed(2),
    written,
  };
  if (!json) {
    console.log(
      `synthesised ${SECONDS} s at ${RATE_HZ} Hz (${log.rows} rows, ${log.channels.length} columns) in ${figures.synthMs} ms (${figures.synthCpuMs} ms CPU): ` +
        `${figures.flightSecondsPerSecond} s of flight per second`,
    );
    console.log(
      `CSV ${figures.csvMB} MB formatted in ${figures.csvMs} ms (${figures.csvMBps} MB/s; ` +
        `toFixed reference ${figures.toFixedMBps} MB/s, ×${figures.csvVsToFixed}); ` +
        `${written ? 'written to' : 'unchanged at'} ${file}`,
    );
  }
  return figures;
};

export default bench;
