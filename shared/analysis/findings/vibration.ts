import type { Finding } from '../../schemas/report';
import type { Thresholds } from '../../schemas/thresholds';
import type { VibrationResult } from '../vibration';
import { level, list } from './words';

/** Band RMS is taken from here up (shared/README.md §7); a line below it is not compared. */
const BAND_LO_HZ = 50;
/**
 * An axis stands out when its band RMS is at least this many times the median of the same
 * sensor's other axes: rotor lines of a healthy aircraft shake the axes alike, a ringing part
 * picks one.
 */
const AXIS_RATIO = 2;

/** Median band RMS of the other axes of the same sensor (gyro or accelerometer). */
function othersMedian(vibration: VibrationResult, channel: string): number {
  const family = channel.slice(0, channel.indexOf('_'));
  const others = Object.entries(vibration.channels)
    .filter(([c]) => c !== channel && c.startsWith(family + '_'))
    .map(([, v]) => v.bandRms)
    .sort((a, b) => a - b);
  if (!others.length) return NaN;
  const m = others.length >> 1;
  return others.length % 2 ? others[m]! : (others[m - 1]! + others[m]!) / 2;
}

type ChannelPeak = VibrationResult['channels'][string]['peaks'][number];

/**
 * Severity of a peak: by its amplitude against the absolute limits, else `note` when it is a
 * labelled rotor or frame line that carries most of its axis's vibration power on an axis that
 * stands out from the sensor's others (it already passed the prominence test above the floor
 * to be a peak at all).
 */
function peakSeverity(
  p: ChannelPeak,
  gyro: boolean,
  bandRms: number,
  othersRms: number,
  th: Thresholds,
): Finding['severity'] | null {
  const sev = gyro
    ? level(p.amplitude, th.gyroToneWatchDegS, th.gyroToneActDegS)
    : level(p.amplitude, th.accToneWatchG, th.accToneActG);
  if (sev) return sev;
  if (p.label === null || p.hz < BAND_LO_HZ || !(bandRms > 0)) return null;
  const share = (p.amplitude * p.amplitude) / 2 / (bandRms * bandRms);
  const standsOut = !(othersRms > 0) || bandRms >= AXIS_RATIO * othersRms;
  return share >= th.toneDominantShare && standsOut ? 'note' : null;
}

function peakFinding(p: ChannelPeak, channel: string, sev: Finding['severity']): Finding {
  const gyro = channel.startsWith('gyro');
  const unit = gyro ? 'deg/s' : 'g';
  const amp = p.amplitude;
  const where = `${Math.round(p.hz)} Hz on ${channel} (about ${amp.toFixed(gyro ? 1 : 2)} ${unit})`;
  if (p.label === 'frame') {
    return {
      code: 'frame-resonance',
      severity: sev,
      axis: channel,
      message:
        `A vibration at ${where} stays put while the motors change speed: something in the frame ` +
        `rings. With the battery out, tap arms, standoffs, camera and antenna mounts and listen for ` +
        `a buzz; tighten the stack and frame screws, and check for a cracked arm.`,
    };
  }
  if (p.label) {
    const order =
      p.label === 'rotor-1x'
        ? 'once per turn'
        : p.label === 'rotor-2x'
          ? 'twice per turn'
          : 'at blade pass';
    const cands = p.candidates ?? [];
    const who = p.motor
      ? `motor ${p.motor}`
      : cands.length
        ? `motor ${cands.slice(0, -1).join(', ')} or ${cands[cands.length - 1]}`
        : 'a rotor';
    return {
      code: 'rotor-harmonic',
      severity: sev,
      axis: channel,
      ...(p.motor ? { motor: p.motor } : {}),
      message:
        `Vibration at ${where} follows ${who} ${order}. ` +
        (p.label === 'rotor-1x'
          ? `That is usually an unbalanced or chipped prop or a bent shaft: with the battery out, ` +
            `swap ${p.motor ? `motor ${p.motor}'s prop for a new one` : cands.length ? `the props on motors ${list(cands)} for new ones` : 'each prop for a new one'}, check the shaft ` +
            `runs true and the bell is not scraped.`
          : p.label === 'rotor-2x'
            ? `That often means a loose motor mount or a prop not seated flat: with the battery out, ` +
              `tighten the motor screws and reseat the props.`
            : `Blade-pass tones grow with nicked or mismatched blades: inspect every blade tip ` +
              `and replace damaged props as a set.`),
    };
  }
  if (p.aliasOfHz !== undefined) {
    return {
      code: 'vibration-peak',
      severity: sev,
      axis: channel,
      message:
        `A vibration at ${where} matches the motors' electrical frequency (about ${Math.round(p.aliasOfHz)} Hz) ` +
        `folded down by the log rate, so it may be electrical noise rather than shaking; logging at a ` +
        `higher rate tells the two apart. With the battery out, route motor wires away from the ` +
        `flight controller, check the capacitor on the power leads, ` +
        `and check the gyro's own filtering on the filter bench.`,
    };
  }
  return {
    code: 'vibration-peak',
    severity: sev,
    axis: channel,
    message:
      `A strong vibration at ${where} that does not match the rotor speed or a fixed frame ` +
      `mode. With the battery out, check the flight controller's soft mounts and that no ` +
      `wire or strap touches the stack, then look at the filter bench for a notch.`,
  };
}

/** The strongest peak per (label, motor, frequency) across channels, as findings. */
export function vibrationFindings(vibration: VibrationResult, th: Thresholds): Finding[] {
  const seen = new Map<string, { finding: Finding; amp: number }>();
  for (const [channel, v] of Object.entries(vibration.channels)) {
    const gyro = channel.startsWith('gyro');
    for (const p of v.peaks) {
      const sev = peakSeverity(p, gyro, v.bandRms, othersMedian(vibration, channel), th);
      if (!sev) continue;
      const key = `${p.label ?? 'none'}:${p.motor ?? 0}:${Math.round(p.hz / (3 * vibration.df))}`;
      const prev = seen.get(key);
      if (!prev || p.amplitude > prev.amp)
        seen.set(key, { finding: peakFinding(p, channel, sev), amp: p.amplitude });
    }
  }
  return [...seen.values()].map((s) => s.finding);
}
