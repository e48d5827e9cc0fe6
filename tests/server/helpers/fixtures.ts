import { randomUUID, createHash } from 'node:crypto';
import type { FlightReport } from '../../../shared/schemas/report';
import type { AircraftInput } from '../../../shared/schemas/aircraft';
import type { FlightPutInput } from '../../../shared/schemas/flights';

/** "Kite", the demo crew's 5-inch freestyle quad X (default numbering, shared/README.md §4). */
export const kite: AircraftInput = {
  name: 'Kite',
  airframe: {
    name: '5-inch quad X',
    motors: [
      { x: 80, y: 80, spin: 'ccw' },
      { x: -80, y: 80, spin: 'cw' },
      { x: -80, y: -80, spin: 'ccw' },
      { x: 80, y: -80, spin: 'cw' },
    ],
    massG: 650,
    prop: { diameterIn: 5.1, pitchIn: 3.6, blades: 3 },
    escMaxA: 45,
    cells: 6,
  },
  components: { motors: '2207 1950 kV', escRatingA: 45, batteryCells: 6, batteryMah: 1300 },
};

/** A report shaped like the analysis output; numbers are test data, not measurements. */
export function report(over: Partial<FlightReport> = {}): FlightReport {
  return {
    version: 1,
    durationS: 182.5,
    sampleRateHz: 2000,
    rows: 365_000,
    motorCount: 4,
    channels: [
      'time',
      'motor1',
      'motor2',
      'motor3',
      'motor4',
      'gyro_x',
      'gyro_y',
      'gyro_z',
      'vbat',
    ],
    warnings: [],
    airframe: { name: '5-inch quad X', assumed: false },
    segments: { hoverS: 24, hover: [[10, 34]] },
    balance: {
      expectedShare: [0.25, 0.25, 0.25, 0.25],
      measuredShare: [0.27, 0.25, 0.24, 0.24],
      deviationPct: [8, 0, -4, -4],
    },
    torqueSplit: { cwShare: 0.49, ccwShare: 0.51, asymmetryPct: -2 },
    cg: { xMm: 3.1, yMm: 1.2 },
    vibration: {
      gyro_x: { bandRms: 4.2, peaks: [{ hz: 212, db: 8.5, label: 'rotor-1x' }] },
      gyro_y: { bandRms: 3.9, peaks: [] },
    },
    power: {
      cells: 6,
      restCellV: 4.18,
      minCellV: 3.52,
      sagCellV: 0.41,
      internalResistanceOhm: 0.018,
      mAh: 1040,
      wh: 23.5,
    },
    headroom: {
      saturationS: 0.4,
      saturationEvents: [{ t0: 60.1, t1: 60.5, motor: 1 }],
      escPeakA: 38,
      escOverS: 0,
    },
    tracking: {
      roll: { rmsDegS: 12, lagMs: 14 },
      pitch: { rmsDegS: 13, lagMs: 15 },
      yaw: { rmsDegS: 9, lagMs: 22 },
    },
    findings: [
      {
        code: 'motor-working-hard',
        severity: 'watch',
        motor: 1,
        tS: 20,
        message: 'Motor 1 works 8 % above the others in hover; check its prop and bearings.',
      },
      { code: 'battery-sag', severity: 'note', message: 'Cells sagged 0.41 V under load.' },
    ],
    ...over,
  };
}

export const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

export const csvLog = (seed = 'a') =>
  `# craft: Kite\n# note: ${seed}\ntime [s],motor1,motor2,motor3,motor4,gyro_x [deg/s]\n0,0.4,0.41,0.39,0.4,0.1\n0.0005,0.41,0.4,0.4,0.4,0.2\n`;

export function flightBody(
  teamId: string,
  aircraftId: string,
  over: Partial<FlightPutInput> = {},
): FlightPutInput {
  const csv = csvLog(randomUUID());
  return {
    teamId,
    aircraftId,
    recordedAt: '2026-05-02T09:30:00.000Z',
    fileName: 'kite-hover.csv',
    sha256: sha256(csv),
    sizeBytes: csv.length,
    report: report(),
    ...over,
  };
}
