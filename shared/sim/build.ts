import type { Airframe } from '../schemas/airframe';
import type { BuildParams } from './types';

/**
 * Typical figures for a build of this size (illustrative, not a product's datasheet): thrust and
 * power coefficients of a multi-blade small prop, a motor lag growing with prop size, pack
 * capacity growing with take-off mass.
 */
export function defaultBuild(airframe: Airframe): BuildParams {
  const d = airframe.prop.diameterIn;
  const small = d <= 7;
  return {
    thrustToWeight: small ? 5 : 2.8,
    ct: small ? 0.12 : 0.1,
    cp: small ? 0.08 : 0.045,
    rho: 1.225,
    motorTauS: 0.004 * d,
    driveEfficiency: 0.8,
    batteryMah: Math.round((airframe.massG * 2.2) / 100) * 100,
    cellResistanceOhm: 0.008,
    startCharge: 0.97,
    unbalanceGmm: small ? 0.15 : 0.6,
    mountGain: 10,
    gyroNoiseDegS: 0.4,
    accNoiseG: 0.015,
    idle: small ? 0.04 : 0.08,
    rotorHeightMm: small ? 20 : 40,
  };
}
