/**
 * Corner of the setpoint smoothing, Hz: flight controllers smooth the radio's stepped setpoint
 * before differentiating it for feedforward; a few tens of hertz is usual on small builds
 * (common practice). A critically damped second-order smoother delays by 2/ω ≈ 5 ms here.
 */
const SMOOTH_HZ = 60;

/**
 * One axis of the rate controller: the setpoint smoothed by a critically damped second-order
 * filter, a PI on the smoothed setpoint minus the gyro, and feedforward that asks the motors for
 * the angular acceleration the smoothed setpoint needs (J·ṡ), led by the motor lag (+ τ·J·s̈), so
 * a well-tuned aircraft follows the sticks within a few milliseconds rather than trailing them
 * by the PI's own time constant.
 */
export class RateAxis {
  private integ = 0;
  private sp = 0;
  private spRate = 0;
  private readonly w = 2 * Math.PI * SMOOTH_HZ;

  /**
   * `kp`, `ki`: output per rad/s and per rad; `ff`: output per rad/s² of commanded angular
   * acceleration at hover; `motorTauS`: the motors' first-order lag the feedforward leads.
   */
  constructor(
    private readonly kp: number,
    private readonly ki: number,
    private readonly ff: number,
    private readonly motorTauS: number,
  ) {}

  /**
   * Advances by dt with the setpoint and the gyro reading (rad/s) and returns the axis output.
   * `trim` is the collective relative to hover: the integrator holds trim as a share of it, and
   * the feedforward divides by it because each unit of differential output buys moment in
   * proportion to output. `hold` freezes the integrator (mixer saturated); `grounded` resets it
   * and outputs nothing.
   */
  step(
    setpoint: number,
    gyro: number,
    dt: number,
    trim: number,
    hold: boolean,
    grounded: boolean,
  ): number {
    const w = this.w;
    const acc = w * w * (setpoint - this.sp) - 2 * w * this.spRate;
    this.spRate += acc * dt;
    this.sp += this.spRate * dt;
    if (grounded) {
      this.integ = 0;
      return 0;
    }
    const e = this.sp - gyro;
    if (!hold) this.integ += this.ki * e * dt;
    return (
      this.kp * e + this.integ * trim + (this.ff * (this.spRate + this.motorTauS * acc)) / trim
    );
  }
}
