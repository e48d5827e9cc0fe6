/**
 * The full analysis of the 300 s, 4 kHz, 4-motor flight beside the time to parse the same file,
 * in the same run (tests/bench/README.md §1.2: analysis ≤ parse time, one thread). Each is timed twice and
 * the faster run kept, so both get the same warm-up. CPU time is reported beside wall time
 * because the machine is shared: the CPU ratio is the steadier of the two.
 */
import { closeSync, existsSync, openSync, readFileSync, renameSync, writeSync } from 'node:fs';
import { join } from 'node:path';
import { analyzeFlight } from '../../shared/analysis/analyze-flight';
import { parseLog } from '../../shared/log/parse';
import type { ParsedLog } from '../../shared/log/types';
import { writeCanonicalCsvBytes } from '../../shared/sim/csv-writer';
import { scenarios } from '../../shared/sim/scenarios';
import { simulate } from '../../shared/sim/simulate';
import type { Bench } from './registry';

const RUNS = 2;

function ensureLog(dir: string): string {
  const file = join(dir, 'flight-300s-4khz.csv');
  if (existsSync(file)) return file;
  const { log } = simulate(scenarios['clean-quad-x']!, { seconds: 300, rateHz: 4000, seed: 1 });
  const tmp = `${file}.tmp-${process.pid}`;
  const fd = openSync(tmp, 'w');
  try {
    for (const chunk of writeCanonicalCsvBytes(log)) writeSync(fd, chunk);
  } finally {
    closeSync(fd);
  }
  renameSync(tmp, file);
  return file;
}

const bench: Bench = async ({ json, dir }) => {
  const file = ensureLog(dir);
  const bytes = readFileSync(file);
  let parseMs = Infinity;
  let analyzeMs = Infinity;
  let parseCpuMs = Infinity;
  let analyzeCpuMs = Infinity;
  const cpuMs = (since: NodeJS.CpuUsage) => {
    const d = process.cpuUsage(since);
    return (d.user + d.system) / 1000;
  };
  let log: ParsedLog | null = null;
  let findings = 0;
  for (let i = 0; i < RUNS; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    log = parseLog(bytes, { expectedBytes: bytes.length });
    parseMs = Math.min(parseMs, performance.now() - t0);
    parseCpuMs = Math.min(parseCpuMs, cpuMs(c0));
    const c1 = process.cpuUsage();
    const t1 = performance.now();
    const { report } = analyzeFlight(log);
    analyzeMs = Math.min(analyzeMs, performance.now() - t1);
    analyzeCpuMs = Math.min(analyzeCpuMs, cpuMs(c1));
    findings = report.findings.length;
  }
  const figures = {
    rows: log!.rows,
    parseMs: Math.round(parseMs),
    analyzeMs: Math.round(analyzeMs),
    ratio: +(analyzeMs / parseMs).toFixed(2),
    parseCpuMs: Math.round(parseCpuMs),
    analyzeCpuMs: Math.round(analyzeCpuMs),
    cpuRatio: +(analyzeCpuMs / parseCpuMs).toFixed(2),
  };
  if (!json) {
    console.log(
      `${figures.rows} rows (${(bytes.length / 1e6).toFixed(0)} MB): parse ${figures.parseMs} ms, ` +
        `full analysis ${figures.analyzeMs} ms (${findings} findings) — analysis/parse ×${figures.ratio} (target ≤ 1); ` +
        `CPU time ${figures.parseCpuMs} / ${figures.analyzeCpuMs} ms, ×${figures.cpuRatio}`,
    );
  }
  return figures;
};
export default bench;
