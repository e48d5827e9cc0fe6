/** Every benchmark lives in `tests/bench/<name>.bench.ts` and default-exports a `Bench`. */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export interface BenchOptions {
  /** When true the benchmark prints nothing and only returns its figures. */
  json: boolean;
  /** Scratch folder for generated files, kept between runs (`.bench/`). */
  dir: string;
  /** Where the API benchmark keeps its data: the SQLite file, or PostgreSQL + S3 + Redis. */
  engine: 'sqlite' | 'postgres';
}
export type Bench = (options: BenchOptions) => Promise<Record<string, number>>;

/** In the order a full run takes them: fixtures first, the browser last. */
const order = ['synth', 'parse', 'analyze', 'api', 'browser'];

export async function loadBenches(): Promise<Record<string, Bench>> {
  const found: Record<string, Bench> = {};
  for (const name of order) {
    const url = new URL(`./${name}.bench.ts`, import.meta.url);
    if (!existsSync(fileURLToPath(url))) continue;
    const mod = (await import(url.href)) as { default: Bench };
    found[name] = mod.default;
  }
  return found;
}
