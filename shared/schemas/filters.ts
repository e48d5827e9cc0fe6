import { z } from 'zod';

/**
 * One stage of a filter cascade for the filter bench: a first-order low-pass, an RBJ-cookbook
 * biquad low-pass, or an RBJ notch. `hz` is the cutoff (−3 dB for lowpass1, the corner for
 * lowpass2, the centre for a notch); `q` defaults to 1/√2 for lowpass2 (Butterworth) and 3 for
 * a notch (a common starting point for gyro notches).
 */
export const FilterStage = z.object({
  kind: z.enum(['lowpass1', 'lowpass2', 'notch']),
  hz: z.number().positive().finite(),
  q: z.number().positive().max(100).optional(),
});
export type FilterStage = z.infer<typeof FilterStage>;

export const FilterSpec = z.array(FilterStage).max(12);
export type FilterSpec = z.infer<typeof FilterSpec>;

export const DEFAULT_LOWPASS_Q = Math.SQRT1_2;
export const DEFAULT_NOTCH_Q = 3;
