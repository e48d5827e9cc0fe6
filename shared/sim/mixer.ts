/**
 * The flight controller's mixer with desaturation, attitude before collective: when the roll,
 * pitch and yaw demands alone need more than the room between idle and full, they are scaled
 * down together; the collective then shifts the whole set to fit. Writes each motor's output
 * into `u` and leaves whether the attitude demand was cut (`saturated`, which also stops the
 * integrators) and the highest output (`uMax`).
 */
export class Mixer {
  saturated = false;
  uMax = 0;

  constructor(
    private readonly ctl: readonly [Float64Array, Float64Array, Float64Array],
    private readonly collective: Float64Array,
    private readonly idle: number,
  ) {}

  mix(u: Float64Array, throttle: number, oR: number, oP: number, oY: number): void {
    const n = u.length;
    const idle = this.idle;
    const collective = this.collective;
    let lo = Infinity;
    let hi = -Infinity;
    const c0 = this.ctl[0];
    const c1 = this.ctl[1];
    const c2 = this.ctl[2];
    for (let i = 0; i < n; i++) {
      const v = oR * c0[i]! + oP * c1[i]! + oY * c2[i]!;
      u[i] = v;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
    const room = 1 - idle;
    let scale = 1;
    if (hi - lo > room) scale = room / (hi - lo);
    let saturated = scale < 1;
    let uLo = Infinity;
    let uHi = -Infinity;
    for (let i = 0; i < n; i++) {
      const v = throttle * collective[i]! + scale * u[i]!;
      u[i] = v;
      if (v < uLo) uLo = v;
      if (v > uHi) uHi = v;
    }
    let shift = 0;
    if (uHi > 1) shift = 1 - uHi;
    else if (uLo < idle) shift = idle - uLo;
    if (uHi > 1 + 1e-9 || (throttle > 0.05 && uLo < idle - 1e-9 && uHi + shift > 1))
      saturated = true;
    let uMax = 0;
    for (let i = 0; i < n; i++) {
      let v = u[i]! + shift;
      v = v < idle ? idle : v > 1 ? 1 : v;
      u[i] = v;
      if (v > uMax) uMax = v;
    }
    this.saturated = saturated;
    this.uMax = uMax;
  }
}
