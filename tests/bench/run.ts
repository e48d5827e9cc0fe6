/**
 * `npm run bench [-- <name>…] [--json] [--engine sqlite|postgres]`: runs the named benchmarks (all when none is named).
 * Each benchmark measures its own reference in the same run and reports ratios, so the numbers
 * mean something on any machine. Never imported by tests.
 */
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { parseBenchArgs } from './args';
import { loadBenches } from './registry';

const benches = await loadBenches();

const { names, json, engine } = parseBenchArgs(process.argv.slice(2));
if (engine !== 'sqlite' && engine !== 'postgres') {
  console.error(`Unknown engine: ${engine ?? '(none)'}. Known: sqlite, postgres.`);
  process.exit(1);
}
const unknown = names.filter((n) => !(n in benches));
if (unknown.length > 0) {
  console.error(
    `Unknown benchmark: ${unknown.join(', ')}. Known: ${Object.keys(benches).join(', ') || 'none yet'}.`,
  );
  process.exit(1);
}
const chosen = names.length > 0 ? names : Object.keys(benches);
if (chosen.length === 0) {
  console.log('no benchmarks yet');
  process.exit(0);
}
const dir = join(process.cwd(), '.bench');
mkdirSync(dir, { recursive: true });

const results: Record<string, unknown> = {};
for (const name of chosen) {
  const bench = benches[name]!;
  if (!json) console.log(`\n== ${name} ==`);
  results[name] = await bench({ json, dir, engine });
}
if (json) console.log(JSON.stringify(chosen.length === 1 ? results[chosen[0]!] : results));
