import { readFileSync, readdirSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { describe, expect, it } from 'vitest';
import { paths } from '../shared/api/paths';

/**
 * The house rules that keep the tree easy to live in, checked on the files themselves so a
 * change that breaks one fails here with the file named (DEVELOPERS.md, "Layout").
 */
const root = join(import.meta.dirname, '..');
const trees = ['src', 'server', 'shared', 'workers', 'tests', 'e2e'];

/** The CSV byte loop stays in one function on purpose: splitting it costs parse speed. */
const lengthExceptions = new Set(['shared/log/reader.ts']);
const maxLines = 400;

function filesUnder(dir: string, name: RegExp): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(join(root, dir), { withFileTypes: true })) {
    const rel = `${dir}/${entry.name}`;
    if (entry.isDirectory()) {
      if (entry.name === 'node_modules' || entry.name === 'fixtures') continue;
      out.push(...filesUnder(rel, name));
    } else if (name.test(entry.name)) {
      out.push(rel);
    }
  }
  return out;
}

const files = trees.flatMap((d) => filesUnder(d, /\.(ts|tsx)$/));
/** Every document of the repository: the top-level two and each README or contract beside code. */
const markdown = ['README.md', 'DEVELOPERS.md', ...trees.flatMap((d) => filesUnder(d, /\.md$/))];
const text = new Map(files.map((f) => [f, readFileSync(join(root, f), 'utf8')]));
const read = (f: string) => text.get(f) ?? '';

/** Relative import specifiers of a file, resolved to repo paths without extension. */
function importsOf(file: string): string[] {
  const dir = file.split('/').slice(0, -1).join('/');
  const specs = [...read(file).matchAll(/\bfrom\s+'(\.[^']+)'|\bimport\(\s*'(\.[^']+)'\s*\)/g)];
  return specs.map((m) =>
    relative(root, join(root, dir, m[1] ?? m[2] ?? ''))
      .split(sep)
      .join('/'),
  );
}

const featureOf = (file: string) => /^src\/features\/([^/]+)\//.exec(file)?.[1];

describe('layout', () => {
  it('keeps every source file at 400 lines or fewer, but the CSV byte loop', () => {
    const long = files
      .filter((f) => !lengthExceptions.has(f))
      .map((f) => ({ f, lines: read(f).split('\n').length - (read(f).endsWith('\n') ? 1 : 0) }))
      .filter(({ lines }) => lines > maxLines)
      .map(({ f, lines }) => `${f} (${lines})`);
    expect(long).toEqual([]);
  });

  it('has no feature importing another feature', () => {
    const crossings = files
      .filter((f) => featureOf(f) !== undefined)
      .flatMap((f) =>
        importsOf(f)
          .filter((target) => {
            const other = /^src\/features\/([^/]+)/.exec(target)?.[1];
            return other !== undefined && other !== featureOf(f);
          })
          .map((target) => `${f} → ${target}`),
      );
    expect(crossings).toEqual([]);
  });

  it('spells no query key as a literal array outside the key factories', () => {
    const literal = files
      .filter((f) => f.startsWith('src/'))
      .filter((f) => /queryKey:\s*\[/.test(read(f)))
      .map((f) => f);
    expect(literal).toEqual([]);
  });

  it('calls each API path from one client folder', () => {
    // A folder is src/api/<resource> or src/features/<name>; two folders fetching one path
    // would mean two caches of the same server data drifting apart.
    const folderOf = (f: string) =>
      /^src\/api\/([^/.]+)/.exec(f)?.[0] ?? /^src\/features\/[^/]+/.exec(f)?.[0] ?? f;
    const clientFiles = files.filter((f) => f.startsWith('src/') && !f.startsWith('src/cli/'));
    const spread: string[] = [];
    for (const name of Object.keys(paths)) {
      const use = new RegExp(`\\bpaths\\.${name}\\b|pathTo\\(\\s*'${name}'`);
      const folders = new Set(clientFiles.filter((f) => use.test(read(f))).map(folderOf));
      if (folders.size > 1) spread.push(`${name}: ${[...folders].sort().join(', ')}`);
    }
    expect(spread).toEqual([]);
  });

  it('finds the documents it checks', () => {
    // A walk that silently found nothing would make the citation check pass on anything.
    expect(markdown).toEqual(expect.arrayContaining(['server/README.md', 'tests/REFERENCES.md']));
  });

  it('cites no document outside the repository', () => {
    const docs = [...files, ...markdown];
    const body = (f: string) => text.get(f) ?? readFileSync(join(root, f), 'utf8');
    const outside = docs.filter((f) =>
      /PRODUCT\.md|STYLE\.md|STACK\.md|(?:\.\.|\/work)\/shared\/[A-Z]+\.md|(?<![\w/])REFERENCES\.md/.test(
        body(f).replace(/tests\/REFERENCES\.md/g, ''),
      ),
    );
    expect(outside).toEqual([]);
  });
});
