import { z } from 'zod';
import { DisplayName } from './common';

/** Spin seen from above. A cw prop pushes the frame ccw: a negative yaw moment in FRD. */
export const Spin = z.enum(['cw', 'ccw']);
export type Spin = z.infer<typeof Spin>;

/** Motor position in mm from the frame's centre, x forward, y right (FRD). */
export const Motor = z.object({
  x: z.number().finite(),
  y: z.number().finite(),
  spin: Spin,
});
export type Motor = z.infer<typeof Motor>;

export const Prop = z.object({
  diameterIn: z.number().positive().max(60),
  pitchIn: z.number().nonnegative().max(60),
  blades: z.number().int().min(2).max(8),
});
export type Prop = z.infer<typeof Prop>;

export const Airframe = z.object({
  name: DisplayName(120),
  motors: z.array(Motor).min(3).max(16),
  massG: z.number().positive().max(100_000),
  prop: Prop,
  escMaxA: z.number().positive().max(1000).optional(),
  cells: z.number().int().min(1).max(24).optional(),
  /** Exponent of the output → thrust proxy when rpm is not logged (default 2). */
  thrustExponent: z.number().min(1).max(3).optional(),
  /** Magnet poles, to turn eRPM into rpm. */
  poles: z.number().int().min(2).max(64).optional(),
  /** Design CG in mm, defaults to the frame centre (0, 0). */
  cg: z.object({ x: z.number().finite(), y: z.number().finite() }).optional(),
});
export type Airframe = z.infer<typeof Airframe>;
