/**
 * `npm run analyze -- <log.csv[.gz]> [--airframe airframe.json] [--map columns.json]
 * [--bench bench.json] [--baseline report.json …] [--json]`
 * prints a readable verdict, or with --json the flight report (shared/README.md, "Report JSON").
 * Exit codes (./exit-codes.ts): 0 done, 1 a usage mistake or an internal failure, 2 input
 * refused — the message names the file and, where it applies, the line and column. Relative
 * paths resolve against the directory npm was started from.
 */
import { createReadStream, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { z } from 'zod';
import { analyzeFlight, AnalysisInputError } from '../../shared/analysis/analyze-flight';
import { whyNotAnalysable } from '../../shared/log/analysable';
import { ColumnMap } from '../../shared/log/column-map';
import { describePlace, LogFormatError } from '../../shared/log/errors';
import { parseLogStream } from '../../shared/log/parse';
import type { ParsedLog } from '../../shared/log/types';
import { BenchRow } from '../../shared/schemas/aircraft';
import { Airframe } from '../../shared/schemas/airframe';
import { FlightReport } from '../../shared/schemas/report';
import { summary } from './analyze-summary';
import { EXIT, RefusedInput, UsageError } from './exit-codes';
import { readJson } from './read-json';

const USAGE = `Usage: npm run analyze -- <log.csv> [--airframe airframe.json] [--map columns.json] [--bench bench.json] [--baseline report.json …] [--json]

  --airframe  the aircraft's geometry (motors, spins, mass, props); without it a 5-inch quad X is assumed
  --map       how the CSV's headers map to channels, when they are not the canonical ones
  --bench     a bench run of the motor and prop, { "rows": [{ "throttle": 0–1, "thrustG": grams }, …] },
              used as the thrust curve for balance and CG when the log has no rpm
  --baseline  an earlier --json report of the same aircraft (repeat, oldest first): the flight is
              also judged against them, and the report's "drift" says how it differs
  --json      print the flight report as one JSON object instead of the readable summary

Exit codes: 0 done, 1 a mistake in the command line (or an internal failure), 2 a file refused
(the message names the line and column where it applies).`;

interface Args {
  log: string;
  airframe?: string;
  map?: string;
  bench?: string;
  baseline: string[];
  json: boolean;
}

/** A bench-run file: the bench run's readings in the `BenchRow` shape (other fields ignored). */
const BenchFile = z.object({
  rows: z.array(BenchRow).min(2, 'a bench run needs at least two readings'),
});

const FILE_OPTIONS = { '--airframe': 'airframe', '--map': 'map', '--bench': 'bench' } as const;

function parseArgs(argv: string[]): Args {
  const rest: string[] = [];
  const args: Partial<Args> = { json: false, baseline: [] };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '--json') args.json = true;
    else if (a === '--baseline') {
      const v = argv[++i];
      if (!v || v.startsWith('--')) throw new UsageError(`${a} needs a file name.`);
      args.baseline!.push(v);
    } else if (a in FILE_OPTIONS) {
      const v = argv[++i];
      if (!v || v.startsWith('--')) throw new UsageError(`${a} needs a file name.`);
      args[FILE_OPTIONS[a as keyof typeof FILE_OPTIONS]] = v;
    } else if (a === '--help' || a === '-h') throw new UsageError('');
    else if (a.startsWith('--')) throw new UsageError(`Unknown option ${a}.`);
    else rest.push(a);
  }
  if (rest.length !== 1)
    throw new UsageError(rest.length ? 'Give exactly one log file.' : 'Give a log file.');
  return { ...args, log: rest[0]! } as Args;
}

const base = process.env.INIT_CWD ?? process.cwd();
const here = (p: string) => resolve(base, p);

/** Reads the log, refusing one the reader cannot read or the analysis cannot use. */
async function readLog(
  name: string,
  options: { columnMap?: ColumnMap; poles?: number },
): Promise<ParsedLog> {
  const path = here(name);
  let size: number;
  try {
    size = statSync(path).size;
  } catch (err) {
    throw new RefusedInput(`Cannot open the log ${name}: ${(err as Error).message}`, {
      cause: err,
    });
  }
  try {
    const log = await parseLogStream(createReadStream(path), { ...options, expectedBytes: size });
    const refusal = whyNotAnalysable(log);
    if (refusal) throw refusal;
    return log;
  } catch (err) {
    if (err instanceof LogFormatError) {
      const where = /line \d+/i.test(err.message)
        ? ''
        : ` (${describePlace(err.line, err.column, err.header)})`;
      throw new RefusedInput(`${name}: ${err.message}${where}`, { cause: err });
    }
    throw err;
  }
}

async function main(argv: string[]): Promise<number> {
  let args: Args;
  try {
    args = parseArgs(argv);
  } catch (err) {
    if (err instanceof UsageError) {
      console.error(err.message ? `analyze: ${err.message}\n\n${USAGE}` : USAGE);
      return err.message ? EXIT.usage : EXIT.ok;
    }
    throw err;
  }
  try {
    const file = <T>(p: string, schema: z.ZodType<T>, what: string) =>
      readJson(p, here(p), schema, what);
    const airframe = args.airframe ? file(args.airframe, Airframe, 'airframe') : undefined;
    const columnMap = args.map ? file(args.map, ColumnMap, 'column map') : undefined;
    const benchRun = args.bench ? file(args.bench, BenchFile, 'bench run') : undefined;
    const baseline = args.baseline.map((p) => file(p, FlightReport, 'baseline report'));
    const log = await readLog(args.log, {
      ...(columnMap ? { columnMap } : {}),
      ...(airframe?.poles ? { poles: airframe.poles } : {}),
    });
    const result = analyzeFlight(log, {
      ...(airframe ? { airframe } : {}),
      ...(benchRun ? { benchRun } : {}),
      ...(baseline.length ? { baseline: { reports: baseline } } : {}),
    });
    process.stdout.write(
      args.json ? `${JSON.stringify(result.report)}\n` : `${summary(args.log, result)}\n`,
    );
    return EXIT.ok;
  } catch (err) {
    // The analysis refuses what does not fit together (an airframe with another motor count, a
    // bench run it cannot use): the input is refused, not the command line.
    if (err instanceof RefusedInput || err instanceof AnalysisInputError) {
      console.error(`analyze: ${err.message}`);
      return EXIT.refused;
    }
    console.error(`analyze: ${(err as Error).message ?? String(err)}`);
    return EXIT.internal;
  }
}

process.exitCode = await main(process.argv.slice(2));
