import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeFlight } from '../../../shared/analysis/analyze-flight';
import { FlightReport } from '../../../shared/schemas/report';
import { presetAirframe } from '../../../shared/airframe/presets';
import { writeCanonicalCsvBytes } from '../../../shared/sim/csv-writer';
import { scenarios } from '../../../shared/sim/scenarios';
import { simulate } from '../../../shared/sim/simulate';

const root = resolve(__dirname, '../../..');
const cli = join(root, 'src/cli/analyze.ts');
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

  it('judges the flight against --baseline reports of the same aircraft and says how it drifted', () => {
    // Three earlier flights of the same aircraft (other seeds), their reports as --json prints them.
    for (const seed of [4, 5, 6]) {
      const { log, truth } = simulate(scenarios['cg-offset']!, { seed, seconds: 30 });
      const { report } = analyzeFlight(log, { airframe: truth.airframe });
      writeFileSync(join(dir, `earlier-${seed}.json`), JSON.stringify(report));
    }
    const base = ['--baseline', 'earlier-4.json', '--baseline', 'earlier-5.json'];
    const r = analyze(
      ['kite.csv', '--airframe', 'kite.json', ...base, '--baseline', 'earlier-6.json', '--json'],
      dir,
    );
    expect(r.code).toBe(0);
    const report = FlightReport.parse(JSON.parse(r.stdout));
    expect(report.drift!.flights).toBe(3);
    expect(report.drift!.motors.map((m) => m.motor)).toEqual([1, 2, 3, 4]);
    // The same aircraft with the same fault: nothing has moved beyond a point.
    for (const m of report.drift!.motors) expect(Math.abs(m.changePts)).toBeLessThan(1);
    expect(report.findings.filter((f) => f.code.endsWith('drift'))).toEqual([]);
    const none = analyze(['kite.csv', '--airframe', 'kite.json', '--json'], dir);
    expect(FlightReport.parse(JSON.parse(none.stdout)).drift).toBeNull();
    const missing = analyze(['kite.csv', '--baseline', 'nope.json', '--json'], dir);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/baseline report/);
    // Four runs of the tool and three flights simulated: more than the default allowance on a
    // busy machine.
  }, 180_000);

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

  it('exits 2 (input refused) when the airframe does not match the log (6 motors vs 4 columns)', () => {
    const r = analyze(['kite.csv', '--airframe', 'osprey.json'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/4 motor columns.*6 motors/);
  });

  it('exits 2 for a log or airframe file that does not exist', () => {
    const log = analyze(['nowhere.csv'], dir);
    expect(log.code).toBe(2);
    expect(log.stderr).toMatch(/Cannot open the log nowhere\.csv/);
    const frame = analyze(['kite.csv', '--airframe', 'nowhere.json'], dir);
    expect(frame.code).toBe(2);
    expect(frame.stderr).toMatch(/Cannot open the airframe file nowhere\.json/);
  });

  it('exits 2 naming the line of a log with one data row', () => {
    writeFileSync(
      join(dir, 'one.csv'),
      '# craft: Kite\ntime,motor1,motor2,motor3,motor4\n0,0.5,0.5,0.5,0.5\n',
    );
    const r = analyze(['one.csv'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/one\.csv: Line 3: the log holds one sample/);
    expect(r.stdout).toBe('');
  });

  it('exits 2 naming the line and column of a time that never advances', () => {
    const rows = ['motor1,motor2,motor3,motor4,stamp'];
    for (let i = 0; i < 50; i++) rows.push('0.5,0.5,0.5,0.5,12.5');
    writeFileSync(join(dir, 'stalled.csv'), rows.join('\n') + '\n');
    writeFileSync(
      join(dir, 'stalled-map.json'),
      JSON.stringify({
        columns: {
          stamp: { channel: 'time', unit: 's' },
          motor1: { channel: 'motor1' },
          motor2: { channel: 'motor2' },
          motor3: { channel: 'motor3' },
          motor4: { channel: 'motor4' },
        },
      }),
    );
    const r = analyze(['stalled.csv', '--map', 'stalled-map.json'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(
      /Line 2, column 5 \(stamp\): time reads 12\.5 s on every sample from line 2 to line 51/,
    );
  });

  it('exits 2 when time runs backwards through most of the log', () => {
    const rows = ['time,motor1,motor2,motor3,motor4'];
    for (let i = 0; i < 50; i++) rows.push(`${(50 - i) * 0.01},0.5,0.5,0.5,0.5`);
    writeFileSync(join(dir, 'backwards.csv'), rows.join('\n') + '\n');
    const r = analyze(['backwards.csv'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/column 1 \(time\): time does not move forward/);
  });

  it('exits 1 with the usage for a mistake in the command line', () => {
    const r = analyze(['kite.csv', '--fast'], dir);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/Unknown option --fast/);
    expect(r.stderr).toMatch(/Exit codes: 0 done, 1 a mistake in the command line/);
    expect(analyze(['kite.csv', '--airframe'], dir).code).toBe(1);
  });

  it('exits 1 without a log file and 0 for --help', () => {
    expect(analyze([], dir).code).toBe(1);
    const help = analyze(['--help'], dir);
    expect(help.code).toBe(0);
    expect(help.stderr).toMatch(/^Usage: npm run analyze/);
  });
});
