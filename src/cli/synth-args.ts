import { scenarios } from '../../shared/sim/scenarios';
import { UsageError } from './exit-codes';

export type SynthCommand =
  | { kind: 'help' }
  | { kind: 'list' }
  | {
      kind: 'run';
      scenario: string;
      seconds?: number;
      rateHz?: number;
      seed: number;
      out: string | null;
      gzip: boolean;
    };

export const SYNTH_USAGE = `Usage: npm run synth -- --scenario <name> [--seconds N] [--rate HZ] [--seed S] [--out file.csv] [--gzip]
       npm run synth -- --list

Synthesises a flight log with known faults: canonical CSV plus <name>.truth.json beside it.
  --scenario  one of the names --list prints
  --seconds   flight length in seconds (10–3600; default per scenario)
  --rate      log rate in Hz (50–20000; default per scenario)
  --seed      integer noise seed (default 1); the same seed gives the same bytes
  --out       output file (default <scenario>.csv, or .csv.gz with --gzip)
  --gzip      compress the CSV with gzip`;

const VALUE_FLAGS = new Set(['--scenario', '--seconds', '--rate', '--seed', '--out']);
const BOOL_FLAGS = new Set(['--gzip', '--list', '--help', '-h']);

function number(flag: string, raw: string, min: number, max: number, integer: boolean): number {
  const v = Number(raw);
  if (
    raw.trim() === '' ||
    !Number.isFinite(v) ||
    (integer && !Number.isInteger(v)) ||
    v < min ||
    v > max
  ) {
    throw new UsageError(
      `${flag} needs ${integer ? 'an integer' : 'a number'} from ${min} to ${max}, got "${raw}"`,
    );
  }
  return v;
}

/** Parses `npm run synth` arguments (after `--`); throws UsageError on anything unknown. */
export function parseSynthArgs(argv: readonly string[]): SynthCommand {
  const values = new Map<string, string>();
  const flags = new Set<string>();
  for (let i = 0; i < argv.length; i++) {
    let arg = argv[i]!;
    let inline: string | undefined;
    const eq = arg.indexOf('=');
    if (arg.startsWith('--') && eq > 0) {
      inline = arg.slice(eq + 1);
      arg = arg.slice(0, eq);
    }
    if (VALUE_FLAGS.has(arg)) {
      const v = inline ?? argv[++i];
      if (v === undefined || (inline === undefined && v.startsWith('--'))) {
        throw new UsageError(`${arg} needs a value`);
      }
      if (values.has(arg)) throw new UsageError(`${arg} given twice`);
      values.set(arg, v);
    } else if (BOOL_FLAGS.has(arg) && inline === undefined) {
      flags.add(arg);
    } else if (arg.startsWith('-')) {
      throw new UsageError(`unknown option ${arg}`);
    } else {
      throw new UsageError(`unexpected argument "${arg}" (did you mean --scenario ${arg}?)`);
    }
  }
  if (flags.has('--help') || flags.has('-h')) return { kind: 'help' };
  if (flags.has('--list')) return { kind: 'list' };
  const scenario = values.get('--scenario');
  if (scenario === undefined) throw new UsageError('--scenario is required (see --list)');
  if (!Object.hasOwn(scenarios, scenario)) {
    throw new UsageError(
      `unknown scenario "${scenario}"; known: ${Object.keys(scenarios).join(', ')}`,
    );
  }
  const seconds = values.has('--seconds')
    ? number('--seconds', values.get('--seconds')!, 10, 3600, false)
    : undefined;
  const rateHz = values.has('--rate')
    ? number('--rate', values.get('--rate')!, 50, 20_000, false)
    : undefined;
  const seed = values.has('--seed')
    ? number('--seed', values.get('--seed')!, 0, 2 ** 31 - 2, true)
    : 1;
  const out = values.get('--out') ?? null;
  if (out !== null && out.trim() === '') throw new UsageError('--out needs a file name');
  return {
    kind: 'run',
    scenario,
    ...(seconds !== undefined ? { seconds } : {}),
    ...(rateHz !== undefined ? { rateHz } : {}),
    seed,
    out,
    gzip: flags.has('--gzip'),
  };
}
