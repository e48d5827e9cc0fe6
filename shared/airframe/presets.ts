import { Airframe, type Motor, type Prop, type Spin } from '../schemas/airframe';

/** Starting points for the airframe editor; every position and spin stays editable. */
export type LayoutPreset =
  'quad-x' | 'quad-plus' | 'stretched-x' | 'wide-front-x' | 'hex-x' | 'octo-x';

export interface LayoutShape {
  /** Stretched X: fore-aft spacing ÷ side spacing (default 1.3). */
  stretch?: number;
  /** Wide-front X: front arm length ÷ rear arm length (default 1.2), front arms stay at 45°. */
  frontArmScale?: number;
}

export interface LayoutPresetInfo {
  label: string;
  description: string;
  motorCount: number;
  /** Motor table for an arm length in mm (centre to motor axis). */
  motors(armMm: number, shape?: LayoutShape): Motor[];
  /** A typical build of this layout, used when presetAirframe gets no override. */
  defaults: {
    armMm: number;
    massG: number;
    prop: Prop;
    cells: number;
    escMaxA: number;
    poles: number;
  };
}

/**
 * Motors on a circle, numbered clockwise seen from above (x forward, y right, so the angle
 * grows from +x towards +y), alternating spins starting with ccw.
 */
function ring(count: number, armMm: number, firstDeg: number): Motor[] {
  const out: Motor[] = [];
  for (let i = 0; i < count; i++) {
    const a = ((firstDeg + (360 / count) * i) * Math.PI) / 180;
    const spin: Spin = i % 2 === 0 ? 'ccw' : 'cw';
    out.push({ x: armMm * Math.cos(a), y: armMm * Math.sin(a), spin });
  }
  return out;
}

/** Quad numbering of shared/README.md §4: 1 FR ccw, 2 RR cw, 3 RL ccw, 4 FL cw. */
function quad(front: number, rear: number, halfWidthFront: number, halfWidthRear: number): Motor[] {
  return [
    { x: front, y: halfWidthFront, spin: 'ccw' },
    { x: -rear, y: halfWidthRear, spin: 'cw' },
    { x: -rear, y: -halfWidthRear, spin: 'ccw' },
    { x: front, y: -halfWidthFront, spin: 'cw' },
  ];
}

const fiveInch: LayoutPresetInfo['defaults'] = {
  armMm: 110,
  massG: 600,
  prop: { diameterIn: 5.1, pitchIn: 3.6, blades: 3 },
  cells: 4,
  escMaxA: 45,
  poles: 14,
};

export const layoutPresets: Record<LayoutPreset, LayoutPresetInfo> = {
  'quad-x': {
    label: 'Quad X',
    description: 'Four arms at 45° to the nose; the common freestyle and racing layout.',
    motorCount: 4,
    motors: (arm) => {
      const d = arm / Math.SQRT2;
      return quad(d, d, d, d);
    },
    defaults: fiveInch,
  },
  'quad-plus': {
    label: 'Quad +',
    description: 'One arm points forward; motors 1 front, 2 right, 3 rear, 4 left.',
    motorCount: 4,
    motors: (arm) => ring(4, arm, 0),
    defaults: fiveInch,
  },
  'stretched-x': {
    label: 'Stretched X',
    description:
      'Motors further apart fore and aft than side to side, for pitch authority and a clear camera view.',
    motorCount: 4,
    motors: (arm, shape) => {
      const stretch = shape?.stretch ?? 1.3;
      // Keep the motor-to-centre distance equal to the arm while stretching the aspect ratio.
      const side = arm / Math.sqrt(1 + stretch * stretch);
      return quad(side * stretch, side * stretch, side, side);
    },
    defaults: fiveInch,
  },
  'wide-front-x': {
    label: 'Wide-front X',
    description:
      'Longer front arms spread the front props out of the camera view; front motors carry less in a hover.',
    motorCount: 4,
    motors: (arm, shape) => {
      const d = arm / Math.SQRT2;
      const f = d * (shape?.frontArmScale ?? 1.2);
      return quad(f, d, f, d);
    },
    defaults: {
      ...fiveInch,
      armMm: 125,
      massG: 900,
      prop: { diameterIn: 6, pitchIn: 3.5, blades: 3 },
      cells: 6,
    },
  },
  'hex-x': {
    label: 'Hex X',
    description:
      'Six arms, two pointing 30° either side of the nose; motors numbered clockwise from front-right.',
    motorCount: 6,
    motors: (arm) => ring(6, arm, 30),
    defaults: {
      armMm: 300,
      massG: 2800,
      prop: { diameterIn: 10, pitchIn: 4.5, blades: 2 },
      cells: 6,
      escMaxA: 40,
      poles: 24,
    },
  },
  'octo-x': {
    label: 'Octo X',
    description:
      'Eight arms, two pointing 22.5° either side of the nose; motors numbered clockwise from front-right.',
    motorCount: 8,
    motors: (arm) => ring(8, arm, 22.5),
    defaults: {
      armMm: 380,
      massG: 4500,
      prop: { diameterIn: 12, pitchIn: 4.5, blades: 2 },
      cells: 6,
      escMaxA: 40,
      poles: 24,
    },
  },
};

export interface PresetOptions extends LayoutShape {
  name?: string;
  armMm?: number;
  massG?: number;
  prop?: Prop;
  cells?: number;
  escMaxA?: number;
  poles?: number;
  thrustExponent?: number;
  cg?: { x: number; y: number };
}

/** An airframe from a layout preset, validated by the shared schema. Arm in mm, mass in g. */
export function presetAirframe(preset: LayoutPreset, options: PresetOptions = {}): Airframe {
  const info = layoutPresets[preset];
  if (!info) throw new RangeError(`unknown layout preset "${String(preset)}"`);
  const d = info.defaults;
  const armMm = options.armMm ?? d.armMm;
  if (!(armMm > 0) || !Number.isFinite(armMm))
    throw new RangeError('armMm must be a positive number');
  const draft = {
    name: options.name ?? info.label,
    motors: info.motors(armMm, options),
    massG: options.massG ?? d.massG,
    prop: options.prop ?? d.prop,
    cells: options.cells ?? d.cells,
    escMaxA: options.escMaxA ?? d.escMaxA,
    poles: options.poles ?? d.poles,
    ...(options.thrustExponent !== undefined ? { thrustExponent: options.thrustExponent } : {}),
    ...(options.cg !== undefined ? { cg: options.cg } : {}),
  };
  return Airframe.parse(draft);
}

/** What the CLI assumes without --airframe: an unknown 5-inch quad X, about 600 g, 4S. */
export const defaultQuadX: Airframe = presetAirframe('quad-x', {
  name: 'Unknown quad X (5-inch, 4S)',
});
