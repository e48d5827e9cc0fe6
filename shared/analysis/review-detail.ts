/**
 * What the review screens draw beyond the flight report: downsampled traces, spectra and the
 * Campbell matrix. Produced by the analysis engine in the worker (or on the server for stored
 * flights), consumed by the charts. Plain arrays of numbers so it survives JSON and
 * structured clone; traces are already downsampled to at most a few thousand points.
 */
export interface Trace {
  /** Seconds from the start of the log. */
  t: number[];
  /** One series per name, same length as `t`. */
  series: Record<string, number[]>;
}

export interface Spectrum {
  /** Bin centre frequencies, Hz. */
  hz: number[];
  /** 10·log10 of the one-sided PSD, (channel unit)²/Hz. */
  db: number[];
}

export interface CampbellMatrix {
  /** What the rows are binned by. */
  by: 'rpm' | 'throttle';
  /** Row centres: mean rotor speed in rpm, or throttle as a 0–1 fraction. */
  rows: number[];
  /** Column centres, Hz. */
  hz: number[];
  /** db[row][col], NaN where no data fell into the row. */
  db: number[][];
  /** Rotor 1× and blade-pass lines to draw over it, as [row value, Hz] pairs. */
  orders: { label: 'rotor-1x' | 'rotor-2x' | 'blade-pass'; points: [number, number][] }[];
}

export interface ReviewDetail {
  /** time, throttle, collective, effort_roll, effort_pitch, effort_yaw, motor1…N. */
  effort: Trace;
  /** gyro_x/y/z and sp_roll/pitch/yaw when logged. */
  tracking: Trace | null;
  /** vbat, cell_v, ibat when logged. */
  power: Trace | null;
  /** Spectrum per vibration channel (gyro_x, …, acc_z). */
  spectra: Record<string, Spectrum>;
  campbell: CampbellMatrix | null;
  /** Pattern diagnosis behind the balance numbers, in words, with a confidence 0–1. */
  diagnosis: {
    pattern: 'healthy' | 'cg-offset' | 'weak-motor' | 'spin-set' | 'too-little-hover';
    motor?: number;
    confidence: number;
    text: string;
  };
}
