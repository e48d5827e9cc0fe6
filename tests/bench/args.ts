/** What `npm run bench [-- <name>…] [--json] [--engine sqlite|postgres]` asks for. */
export interface BenchArgs {
  names: string[];
  json: boolean;
  /** `sqlite` when not given; whatever follows `--engine` otherwise (checked by the caller). */
  engine: string | undefined;
}

/** The word after `--engine` is its value, never a benchmark name; flags go anywhere. */
export function parseBenchArgs(args: readonly string[]): BenchArgs {
  const engineAt = args.indexOf('--engine');
  const engineValueAt = engineAt >= 0 ? engineAt + 1 : -1;
  return {
    names: args.filter((a, i) => !a.startsWith('--') && i !== engineValueAt),
    json: args.includes('--json'),
    engine: engineAt >= 0 ? args[engineValueAt] : 'sqlite',
  };
}
