import type { FlightReport } from '../../../shared/schemas/report';
import type { ReviewDetail } from '../../../shared/analysis/review-detail';

/** A small, schema-valid report for storage and sync tests (demo values, not a measurement). */
export function sampleReport(overrides: Partial<FlightReport> = {}): FlightReport {
  return {
    version: 1,
    durationS: 12,
    sampleRateHz: 500,
    rows: 6000,
    motorCount: 4,
    channels: ['time', 'motor1', 'motor2', 'motor3', 'motor4'],
    warnings: [],
    airframe: { name: 'Kite', assumed: false },
    segments: { hoverS: 6, hover: [[2, 8]] },
    balance: {
      expectedShare: [0.25, 0.25, 0.25, 0.25],
      measuredShare: [0.27, 0.25, 0.24, 0.24],
      deviationPct: [8, 0, -4, -4],
    },
    torqueSplit: { cwShare: 0.49, ccwShare: 0.51, asymmetryPct: -2 },
    cg: { xMm: 3, yMm: 1 },
    vibration: {},
    power: null,
    headroom: { saturationS: 0, saturationEvents: [], escPeakA: null, escOverS: 0 },
    tracking: null,
    findings: [
      {
        code: 'motor-working-hard',
        severity: 'watch',
        motor: 1,
        message: 'Motor 1 works 8 % harder.',
      },
    ],
    ...overrides,
  };
}

export function sampleDetail(): ReviewDetail {
  return {
    effort: { t: [0, 1], series: { throttle: [0.4, 0.41] } },
    tracking: null,
    power: null,
    spectra: {},
    campbell: null,
    diagnosis: { pattern: 'healthy', confidence: 0.5, text: 'Balanced.' },
  };
}

export function sampleFile(text = 'time,motor1\n0,0.5\n'): Blob {
  return new Blob([text], { type: 'text/csv' });
}
