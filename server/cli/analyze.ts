/**
 * `npm run analyze -- <log.csv[.gz]> [--airframe airframe.json] [--map columns.json]
 * [--bench bench.json] [--json]`
 * prints a readable verdict, or with --json the flight report (PRODUCT.md §7). Exit 0 on
 * success, 2 on input it cannot read (the message names the line and column), 1 on anything
 * else. Relative paths resolve against the directory npm was started from.
 */
import { createReadStream, readFileSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { z } from 'zod';
import {
  analyzeFlight,
  AnalysisInputError,
  type FlightAnalysis,
} from '../../shared/analysis/analyze-flight';
import { ColumnMap } from '../../shared/log/column-map';
import { describePlace, LogFormatError } from '../../shared/log/errors';
import { parseLogStream } from '../../shared/log/parse';
import { BenchRow } from '../../shared/schemas/aircraft';
import { Airframe } from '../../shared/schemas/airframe';

const USAGE = `Usage: npm run analyze -- <log.csv> [--airframe airframe.json] [--map columns.json] [--bench bench.json] [--json]

  --airframe  the aircraft's geometry (motors, spins, mass, props); without it a 5-inch quad X is assumed
  --map       how the CSV's headers map to channels, when they are not the canonical ones
  --bench     a bench run of the motor and prop, { "rows": [{ "throttle": 0–1, "thrustG": grams }, …] },
              used as the thrust curve for balance and CG when the log has no rpm
  --json      print the flight report as one JSON object instead of the readable summary`;

/** Input the tool cannot read: exit 2. */
class UnreadableInput extends Error {}
/** A wrong command line: exit 1 with the usage. */
class UsageError extends Error {}

interface Args {
  log: string;
  airframe?: string;
  map?: string;
  bench?: string;
  json: boolean;
}

/** A bench-run file: the bench run's readings in the `BenchRow` shape (other fields ignored). */
const BenchFile = z.object({
  rows: z.array(BenchRow).min(2, 'a bench run needs at least two readings'),
});

const FILE_OPTIONS = { '--airframe': 'airframe', '--map': 'map', '--bench': 'bench' } as const;

function parseArgs(argv: string[]): Args {
  const rest: string[] = [];
  const args: Partial<Args> = { json: false };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '--json') args.json = true;
    else if (a in FILE_OPTIONS) {
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

/** 1-based line and column of a character offset, as an editor shows them. */
function place(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  return { line, column: offset - (before.lastIndexOf('\n') + 1) + 1 };
}

/** Reads and validates a small JSON file; unreadable content is exit 2 with line and column. */
function readJson<T>(path: string, schema: z.ZodType<T>, what: string): T {
  let text: string;
  try {
    text = readFileSync(here(path), 'utf8');
  } catch (err) {
    throw new Error(`Cannot open the ${what} file ${path}: ${(err as Error).message}`, {
      cause: err,
    });
  }
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (err) {
    const msg = (err as Error).message;
    const pos = /position (\d+)/.exec(msg);
    const at = pos ? place(text, Number(pos[1])) : { line: 1, column: 1 };
    throw new UnreadableInput(
      `${path}: ${describePlace(at.line, at.column)}: not valid JSON (${msg}).`,
    );
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    const key = issue.path[issue.path.length - 1];
    // Point at the offending key when it appears once in the text.
    const needle = typeof key === 'string' ? `"${key}"` : null;
    const idx = needle ? text.indexOf(needle) : -1;
    const at =
      idx >= 0 && text.indexOf(needle!, idx + 1) < 0 ? place(text, idx) : { line: 1, column: 1 };
    throw new UnreadableInput(
      `${path}: ${describePlace(at.line, at.column)}: not a usable ${what}: ` +
        `${issue.path.join('.') || '(top level)'}: ${issue.message}.`,
    );
  }
  return parsed.data;
}

const pct = (v: number) => `${v >= 0 ? '+' : ''}${v.toFixed(1)} %`;
const fix = (v: number | null | undefined, d = 1) =>
  v === null || v === undefined ? '—' : v.toFixed(d);

/** The readable summary: verdict first, then the numbers a tuner reads. */
function summary(file: string, { report: r, detail }: FlightAnalysis): string {
  const out: string[] = [];
  out.push(`Hoverprint · ${file}`);
  out.push(
    `${r.durationS.toFixed(1)} s · ${r.rows} rows at ${Math.round(r.sampleRateHz)} Hz · ${r.motorCount} motors · airframe: ${r.airframe.name}` +
      (r.airframe.assumed ? ' (ASSUMED — pass --airframe for your aircraft)' : ''),
  );
  out.push('');
  out.push('Verdict');
  if (r.findings.length === 0) out.push('  No findings: nothing over the team thresholds.');
  for (const f of r.findings) {
    const tag = f.severity.toUpperCase().padEnd(5);
    const where = [
      f.motor ? `motor ${f.motor}` : '',
      f.axis ?? '',
      f.tS !== undefined ? `t=${f.tS.toFixed(1)} s` : '',
    ]
      .filter(Boolean)
      .join(', ');
    out.push(`  ${tag} ${f.code}${where ? ` (${where})` : ''}`);
    out.push(`        ${f.message}`);
  }
  out.push('');
  out.push(`Hover: ${r.segments.hoverS.toFixed(1)} s in ${r.segments.hover.length} stretch(es)`);
  out.push(
    `Pattern: ${detail.diagnosis.text} (confidence ${Math.round(detail.diagnosis.confidence * 100)} %)`,
  );
  if (r.balance.deviationPct.length) {
    out.push('Balance (hover output vs what the frame predicts)');
    r.balance.deviationPct.forEach((d, i) =>
      out.push(
        `  motor ${i + 1}: ${pct(d).padStart(8)}   share ${(100 * r.balance.measuredShare[i]!).toFixed(1)} % (expected ${(100 * r.balance.expectedShare[i]!).toFixed(1)} %)`,
      ),
    );
    out.push(
      `Torque split: cw ${(100 * r.torqueSplit.cwShare).toFixed(1)} % / ccw ${(100 * r.torqueSplit.ccwShare).toFixed(1)} % (asymmetry ${pct(r.torqueSplit.asymmetryPct)})`,
    );
  }
  if (r.cg)
    out.push(`CG: x ${r.cg.xMm.toFixed(1)} mm (forward +), y ${r.cg.yMm.toFixed(1)} mm (right +)`);
  const vib = Object.entries(r.vibration);
  if (vib.length) {
    out.push('Vibration (band RMS 50 Hz–Nyquist; loudest peaks)');
    for (const [ch, v] of vib) {
      const peaks = v.peaks
        .slice(0, 3)
        .map(
          (p) =>
            `${p.hz.toFixed(0)} Hz ${p.db.toFixed(0)} dB${p.label ? ` ${p.label}` : ''}${p.motor ? ` m${p.motor}` : ''}`,
        )
        .join(', ');
      out.push(
        `  ${ch.padEnd(7)} ${v.bandRms.toFixed(2).padStart(7)}  ${peaks || 'no clear peaks'}`,
      );
    }
  }
  if (r.power) {
    const p = r.power;
    out.push(
      `Power: ${p.cells}S, rest ${p.restCellV.toFixed(2)} V/cell, min ${p.minCellV.toFixed(2)} V/cell under load (sag ${p.sagCellV.toFixed(2)} V), ` +
        `R ${p.internalResistanceOhm === null ? '—' : `${(p.internalResistanceOhm * 1000).toFixed(0)} mΩ`}, ${fix(p.mAh, 0)} mAh, ${fix(p.wh, 2)} Wh`,
    );
  }
  const h = r.headroom;
  out.push(
    `Headroom: ${h.saturationS.toFixed(2)} s saturated (${h.saturationEvents.length} events), ESC peak ${h.escPeakA === null ? '—' : `${h.escPeakA.toFixed(1)} A`}, over rating ${h.escOverS.toFixed(2)} s`,
  );
  if (r.tracking) {
    const t = r.tracking;
    const ax = (n: string, a: { rmsDegS: number; lagMs: number | null }) =>
      `${n} ${a.rmsDegS.toFixed(1)} deg/s RMS, lag ${a.lagMs === null ? '—' : `${a.lagMs.toFixed(0)} ms`}`;
    out.push(`Tracking: ${ax('roll', t.roll)}; ${ax('pitch', t.pitch)}; ${ax('yaw', t.yaw)}`);
  }
  if (r.warnings.length) {
    out.push('');
    out.push('Warnings');
    for (const w of r.warnings) out.push(`  - ${w}`);
  }
  out.push('');
  out.push(
    'Findings are advice, not an airworthiness sign-off. Take the props off for bench checks, handle LiPos with care, and fly by your local rules.',
  );
  return out.join('\n');
}

async function main(argv: string[]): Promise<number> {
  let args: Args;
  try {
    args = parseArgs(argv);
  } catch (err) {
    if (err instanceof UsageError) {
      console.error(err.message ? `analyze: ${err.message}\n\n${USAGE}` : USAGE);
      return err.message ? 1 : 0;
    }
    throw err;
  }
  try {
    const airframe = args.airframe ? readJson(args.airframe, Airframe, 'airframe') : undefined;
    const columnMap = args.map ? readJson(args.map, ColumnMap, 'column map') : undefined;
    const benchRun = args.bench ? readJson(args.bench, BenchFile, 'bench run') : undefined;
    const path = here(args.log);
    let size: number;
    try {
      size = statSync(path).size;
    } catch (err) {
      throw new Error(`Cannot open the log ${args.log}: ${(err as Error).message}`, { cause: err });
    }
    let log;
    try {
      log = await parseLogStream(createReadStream(path), {
        ...(columnMap ? { columnMap } : {}),
        ...(airframe?.poles ? { poles: airframe.poles } : {}),
        expectedBytes: size,
      });
    } catch (err) {
      if (err instanceof LogFormatError) {
        const where = /line \d+/i.test(err.message)
          ? ''
          : ` (${describePlace(err.line, err.column, err.header)})`;
        throw new UnreadableInput(`${args.log}: ${err.message}${where}`, { cause: err });
      }
      throw err;
    }
    const result = analyzeFlight(log, {
      ...(airframe ? { airframe } : {}),
      ...(benchRun ? { benchRun } : {}),
    });
    process.stdout.write(
      args.json ? `${JSON.stringify(result.report)}\n` : `${summary(args.log, result)}\n`,
    );
    return 0;
  } catch (err) {
    if (err instanceof UnreadableInput) {
      console.error(`analyze: ${err.message}`);
      return 2;
    }
    if (err instanceof AnalysisInputError) {
      console.error(`analyze: ${err.message}`);
      return 1;
    }
    console.error(`analyze: ${(err as Error).message ?? String(err)}`);
    return 1;
  }
}

process.exitCode = await main(process.argv.slice(2));
