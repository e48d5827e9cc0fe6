import type { ParsedLog } from '../log/types';

/** The synthesised log's columns in canonical units, filled row by row. */
export interface SimColumns {
  time: Float64Array;
  motor: Float32Array[];
  rpm: Float32Array[];
  /** Per-ESC current, when the scenario logs it. */
  imotor: Float32Array[] | null;
  gyroX: Float32Array;
  gyroY: Float32Array;
  gyroZ: Float32Array;
  accX: Float32Array;
  accY: Float32Array;
  accZ: Float32Array;
  spRoll: Float32Array;
  spPitch: Float32Array;
  spYaw: Float32Array;
  throttle: Float32Array;
  vbat: Float32Array;
  ibat: Float32Array;
}

export function allocateColumns(n: number, rows: number, motorCurrent: boolean): SimColumns {
  const per = () => Array.from({ length: n }, () => new Float32Array(rows));
  const one = () => new Float32Array(rows);
  return {
    time: new Float64Array(rows),
    motor: per(),
    rpm: per(),
    imotor: motorCurrent ? per() : null,
    gyroX: one(),
    gyroY: one(),
    gyroZ: one(),
    accX: one(),
    accY: one(),
    accZ: one(),
    spRoll: one(),
    spPitch: one(),
    spYaw: one(),
    throttle: one(),
    vbat: one(),
    ibat: one(),
  };
}

/** The columns as a ParsedLog in canonical channel order, as the CSV reader would return them. */
export function assembleLog(
  c: SimColumns,
  rateHz: number,
  metadata: Record<string, string>,
): ParsedLog {
  const n = c.motor.length;
  const rows = c.time.length;
  const channels: string[] = ['time'];
  const columns: ParsedLog['columns'] = { time: c.time };
  const add = (name: string, col: Float32Array) => {
    channels.push(name);
    columns[name] = col;
  };
  for (let i = 0; i < n; i++) add(`motor${i + 1}`, c.motor[i]!);
  for (let i = 0; i < n; i++) add(`rpm${i + 1}`, c.rpm[i]!);
  add('gyro_x', c.gyroX);
  add('gyro_y', c.gyroY);
  add('gyro_z', c.gyroZ);
  add('acc_x', c.accX);
  add('acc_y', c.accY);
  add('acc_z', c.accZ);
  add('sp_roll', c.spRoll);
  add('sp_pitch', c.spPitch);
  add('sp_yaw', c.spYaw);
  add('throttle', c.throttle);
  add('vbat', c.vbat);
  add('ibat', c.ibat);
  if (c.imotor) for (let i = 0; i < n; i++) add(`imotor${i + 1}`, c.imotor[i]!);
  return {
    channels,
    columns,
    rows,
    sampleRateHz: rateHz,
    durationS: (rows - 1) / rateHz,
    metadata,
    warnings: [],
  };
}
