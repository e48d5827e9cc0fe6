import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FlightReport } from '../../../shared/analysis/report-schema';
import { presetAirframe } from '../../../shared/airframe/presets';
import { writeCanonicalCsvBytes } from '../../../shared/sim/csv-writer';
import { scenarios } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';

const root = resolve(__dirname, '../../..');
const cli = join(root, 'server/cli/analyze.ts');
const tsx = join(root, 'node_modules/.bin/tsx');
let dir: string;

function analyze(args: string[], cwd = root) {
  const r = spawnSync(tsx, [cli, ...args], {
    cwd,
    encoding: 'utf8',
    env: { ...process.env, INIT_CWD: cwd },
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'hp-analyze-'));
  const { log, truth } = simulate(scenarios['cg-offset']!, { seed: 3, seconds: 30 });
  const chunks = [...writeCanonicalCsvBytes(log)];
  writeFileSync(join(dir, 'kite.csv'), Buffer.concat(chunks.map((c) => Buffer.from(c))));
  writeFileSync(
    join(dir, 'kite.json'),
    JSON.stringify({ ...truth.airframe, name: 'Kite' }, null, 2),
  );
  writeFileSync(
    join(dir, 'osprey.json'),
    JSON.stringify(presetAirframe('hex-x', { name: 'Osprey' })),
  );
  writeFileSync(
    join(dir, 'broken.json'),
    '{\n  "name": "Kite",\n  "motors": [\n    { "x": 1, }\n  ]\n}\n',
  );
  writeFileSync(
    join(dir, 'bad.csv'),
    '# craft: Kite\ntime,motor1,motor2,motor3,motor4\n0,0.1,0.1,0.1,0.1\n0.001,0.1,abc,0.1,0.1\n',
  );
  const rows = ['stamp_ms;out_a;out_b;out_c;out_d'];
  for (let i = 0; i < 400; i++) rows.push(`${i * 2};1300;1310;1300;1290`);
  writeFileSync(join(dir, 'other.csv'), rows.join('\n') + '\n');
  writeFileSync(
    join(dir, 'map.json'),
    JSON.stringify({
      columns: {
        stamp_ms: { channel: 'time', unit: 'ms' },
        out_a: { channel: 'motor1', unit: 'us' },
        out_b: { channel: 'motor2', unit: 'us' },
        out_c: { channel: 'motor3', unit: 'us' },
        out_d: { channel: 'motor4', unit: 'us' },
      },
    }),
  );
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The same flight without its rpm columns: balance then rests on the thrust curve. */
function writeWithoutRpm() {
  const { log } = simulate(scenarios['cg-offset']!, { seed: 3, seconds: 30 });
  for (let m = 1; m <= 4; m++) delete log.columns[`rpm${m}`];
  log.channels = log.channels.filter((c) => !c.startsWith('rpm'));
  const chunks = [...writeCanonicalCsvBytes(log)];
  writeFileSync(join(dir, 'no-rpm.csv'), Buffer.concat(chunks.map((c) => Buffer.from(c))));
}

describe('npm run analyze', () => {
  it('prints a readable verdict, says the airframe was assumed, exits 0', () => {
    const r = analyze([join(dir, 'kite.csv')]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Verdict/);
    expect(r.stdout).toMatch(/ASSUMED/);
    expect(r.stdout).toMatch(/cg-offset/);
    expect(r.stdout).toMatch(/not an airworthiness sign-off/);
  });

  it('prints one JSON object matching the report schema with --json and --airframe', () => {
    const r = analyze(['kite.csv', '--airframe', 'kite.json', '--json'], dir);
    expect(r.code).toBe(0);
    const report = FlightReport.parse(JSON.parse(r.stdout));
    expect(report.airframe).toEqual({ name: 'Kite', assumed: false });
    expect(report.motorCount).toBe(4);
    expect(report.rows).toBe(30001);
    expect(report.cg!.xMm).toBeGreaterThan(10);
    expect(Object.keys(report.vibration)).toEqual([
      'gyro_x',
      'gyro_y',
      'gyro_z',
      'acc_x',
      'acc_y',
      'acc_z',
    ]);
    expect(report.power?.cells).toBe(4);
  });

  it('takes balance and CG through a --bench thrust curve when the log has no rpm', () => {
    writeFileSync(
      join(dir, 'bench.json'),
      JSON.stringify({
        date: '2026-10-01',
        rows: [
          { throttle: 0, thrustG: 0 },
          { throttle: 0.5, thrustG: 500 },
          { throttle: 1, thrustG: 1000 },
        ],
      }),
    );
    writeWithoutRpm();
    const plain = analyze(['no-rpm.csv', '--airframe', 'kite.json', '--json'], dir);
    const bench = analyze(
      ['no-rpm.csv', '--airframe', 'kite.json', '--bench', 'bench.json', '--json'],
      dir,
    );
    expect(bench.code).toBe(0);
    const a = FlightReport.parse(JSON.parse(plain.stdout));
    const b = FlightReport.parse(JSON.parse(bench.stdout));
    // Thrust ∝ output on this bench against output² without it: to first order each motor's
    // share moves half as far from equal, so the CG reads about half as far forward.
    expect(b.cg!.xMm / a.cg!.xMm).toBeGreaterThan(0.4);
    expect(b.cg!.xMm / a.cg!.xMm).toBeLessThan(0.6);
  });

  it('exits 2 naming the place of a bench file it cannot use', () => {
    writeFileSync(
      join(dir, 'bench-bad.json'),
      '{\n  "rows": [\n    { "throttle": 2, "thrustG": 5 }\n  ]\n}\n',
    );
    const r = analyze(['kite.csv', '--bench', 'bench-bad.json'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/bench run/);
  });

  it('reads a foreign header through --map', () => {
    const r = analyze(['other.csv', '--map', 'map.json', '--json'], dir);
    expect(r.code).toBe(0);
    const report = FlightReport.parse(JSON.parse(r.stdout));
    expect(report.channels).toContain('motor4');
    expect(report.sampleRateHz).toBeCloseTo(500, 3);
    expect(report.tracking).toBeNull();
    expect(report.power).toBeNull();
  });

  it('exits 2 naming the line and column of an unreadable cell (metadata and header lines count)', () => {
    const r = analyze(['bad.csv'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/line 4/i);
    expect(r.stderr).toMatch(/column 3/i);
    expect(r.stdout).toBe('');
  });

  it('exits 2 naming the line and column of broken airframe JSON', () => {
    const r = analyze(['kite.csv', '--airframe', 'broken.json'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/broken\.json: line 4, column \d+/);
  });

  it('exits 1 when the airframe does not match the log (6 motors vs 4 columns)', () => {
    const r = analyze(['kite.csv', '--airframe', 'osprey.json'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/4 motor columns.*6 motors/);
  });

  it('exits 1 for a missing file or an unknown option', () => {
    expect(analyze(['nowhere.csv'], dir).code).toBe(1);
    const r = analyze(['kite.csv', '--fast'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/Unknown option --fast/);
  });
});
