import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseLog } from '../../../shared/log/parse';
import { readFileSync } from 'node:fs';

const root = resolve(__dirname, '../../..');
const cli = join(root, 'src/cli/synth.ts');
const tsx = join(root, 'node_modules/.bin/tsx');
let dir: string;

function synth(args: string[]) {
  const r = spawnSync(tsx, [cli, ...args], {
    cwd: dir,
    encoding: 'utf8',
    env: { ...process.env, INIT_CWD: dir },
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'hp-synth-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('npm run synth', () => {
  it('writes a log and its ground truth, exits 0', () => {
    const r = synth([
      '--scenario',
      'weak-motor',
      '--seconds',
      '10',
      '--rate',
      '200',
      '--out',
      'w.csv',
    ]);
    expect(r.code).toBe(0);
    expect(readdirSync(dir).sort()).toEqual(['w.csv', 'w.truth.json']);
    const log = parseLog(readFileSync(join(dir, 'w.csv')));
    expect(log.sampleRateHz).toBeCloseTo(200, 6);
  });

  it('exits 1 with the usage for a mistake in the command line, like analyze', () => {
    const r = synth(['--scenario', 'weak-motor', '--fast']);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/unknown option --fast/);
    expect(r.stderr).toMatch(/Usage: npm run synth/);
    expect(synth(['--scenario', 'no-such-flight']).code).toBe(1);
    expect(synth([]).code).toBe(1);
  });

  it('exits 2 when the output folder does not exist, and writes nothing', () => {
    const r = synth(['--scenario', 'weak-motor', '--out', join('missing', 'w.csv')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/output folder .*missing does not exist/);
    expect(existsSync(join(dir, 'missing'))).toBe(false);
  });

  it('exits 0 for --list and --help', () => {
    const list = synth(['--list']);
    expect(list.code).toBe(0);
    expect(list.stdout).toMatch(/^weak-motor\s/m);
    expect(synth(['--help']).code).toBe(0);
  });
});
