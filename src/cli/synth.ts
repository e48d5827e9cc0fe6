/**
 * `npm run synth -- --scenario <name> [--seconds N] [--rate HZ] [--seed S] [--out file.csv]
 * [--gzip]` writes a synthetic flight log and its ground truth; `--list` names the scenarios.
 * Exit codes as `npm run analyze` (./exit-codes.ts): 0 done, 1 a usage mistake or an internal
 * failure, 2 an output folder that does not exist. Files are written to a temporary name and
 * renamed, so a failure never leaves half a log behind.
 */
import {
  createWriteStream,
  existsSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { createGzip } from 'node:zlib';
import { writeCanonicalCsvBytes } from '../../shared/sim/csv-writer';
import { scenarios } from '../../shared/sim/scenarios';
import { simulate } from '../../shared/sim/simulate';
import { EXIT, UsageError } from './exit-codes';
import { parseSynthArgs, SYNTH_USAGE } from './synth-args';

function truthPathFor(csvPath: string): string {
  const name = basename(csvPath)
    .replace(/\.csv(\.gz)?$/i, '')
    .replace(/\.gz$/i, '');
  return join(dirname(csvPath), `${name}.truth.json`);
}

async function main(argv: string[]): Promise<number> {
  let command;
  try {
    command = parseSynthArgs(argv);
  } catch (err) {
    if (err instanceof UsageError) {
      console.error(`synth: ${err.message}\n\n${SYNTH_USAGE}`);
      return EXIT.usage;
    }
    throw err;
  }
  if (command.kind === 'help') {
    console.log(SYNTH_USAGE);
    return EXIT.ok;
  }
  if (command.kind === 'list') {
    const width = Math.max(...Object.keys(scenarios).map((k) => k.length));
    for (const [name, s] of Object.entries(scenarios))
      console.log(`${name.padEnd(width)}  ${s.describe}`);
    return EXIT.ok;
  }

  const base = process.env.INIT_CWD ?? process.cwd();
  const defaultName = `${command.scenario}.csv${command.gzip ? '.gz' : ''}`;
  let csvPath = resolve(base, command.out ?? defaultName);
  if (command.gzip && !/\.gz$/i.test(csvPath)) csvPath += '.gz';
  const truthPath = truthPathFor(csvPath);
  const folder = dirname(csvPath);
  if (!existsSync(folder) || !statSync(folder).isDirectory()) {
    console.error(`synth: the output folder ${folder} does not exist`);
    return EXIT.refused;
  }
  const scenario = scenarios[command.scenario]!;
  const started = performance.now();
  const { log, truth } = simulate(scenario, {
    ...(command.seconds !== undefined ? { seconds: command.seconds } : {}),
    ...(command.rateHz !== undefined ? { rateHz: command.rateHz } : {}),
    seed: command.seed,
  });
  const simMs = performance.now() - started;

  const tmpCsv = `${csvPath}.tmp-${process.pid}`;
  const tmpTruth = `${truthPath}.tmp-${process.pid}`;
  try {
    const source = Readable.from(writeCanonicalCsvBytes(log));
    if (command.gzip) await pipeline(source, createGzip(), createWriteStream(tmpCsv));
    else await pipeline(source, createWriteStream(tmpCsv));
    writeFileSync(tmpTruth, JSON.stringify(truth, null, 2) + '\n');
    renameSync(tmpCsv, csvPath);
    renameSync(tmpTruth, truthPath);
  } catch (err) {
    rmSync(tmpCsv, { force: true });
    rmSync(tmpTruth, { force: true });
    throw err;
  }
  const totalS = (performance.now() - started) / 1000;
  console.log(
    `${command.scenario}: ${log.rows} rows, ${log.durationS.toFixed(1)} s at ${log.sampleRateHz} Hz, seed ${command.seed}` +
      ` → ${csvPath} (+ ${basename(truthPath)}) in ${totalS.toFixed(2)} s (physics ${(simMs / 1000).toFixed(2)} s)`,
  );
  return EXIT.ok;
}

main(process.argv.slice(2)).then(
  (code) => process.exit(code),
  (err: unknown) => {
    console.error(`synth: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(EXIT.internal);
  },
);
