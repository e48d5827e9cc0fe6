import type { Finding, PeakLabel, Severity } from '../../schemas/report';
import { severityRank } from '../../schemas/report';
import type { Thresholds } from '../../schemas/thresholds';
import type { VibrationResult } from '../vibration';
import {
  distinctLines,
  groupPeaks,
  type GroupablePeak,
  type VibrationCause,
} from '../vibration-groups';
import { level, list } from './words';

/**
 * The vibration part of the verdict: one finding per cause (analysis/vibration-groups.ts),
 * not per peak. Its severity is that of its strongest member; the message names the cause, the
 * strongest line, and every axis, speed and harmonic the cause showed on, so a chipped prop seen
 * at four speeds on five axes reads as the one prop it is.
 */

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

interface Member extends GroupablePeak {
  /** Amplitude under the peak in channel units (vibration.ts, peakAmplitude). */
  amplitude: number;
  /** The peak's own severity (peakSeverity), before the cause takes its strongest member's. */
  severity: Severity | null;
}

const ORDER_WORDS: Record<Exclude<PeakLabel, null | 'frame'>, string> = {
  'rotor-1x': 'once per turn',
  'rotor-2x': 'twice per turn',
  'blade-pass': 'at blade pass',
};

const isGyro = (channel: string) => channel.startsWith('gyro');
const unitOf = (channel: string) => (isGyro(channel) ? 'deg/s' : 'g');
const fmtAmp = (m: Member) =>
  `${m.amplitude.toFixed(isGyro(m.channel) ? 1 : 2)} ${unitOf(m.channel)}`;

/** How far over its own watch threshold a member is, so gyro and accelerometer compare. */
function overWatch(m: Member, th: Thresholds): number {
  return m.amplitude / (isGyro(m.channel) ? th.gyroToneWatchDegS : th.accToneWatchG);
}

/** "seen on gyro_x, gyro_y and acc_x at 173, 189 and 321 Hz (rotor speeds …)". */
function seenSentence(cause: VibrationCause<Member>, df: number): string {
  const lines = distinctLines(cause, df);
  const hz = lines.map((l) => Math.round(l.hz));
  let text = `Seen on ${list(cause.channels)} at ${list(hz)} Hz`;
  if (cause.kind === 'rotor') {
    const rpm = lines.flatMap((l) =>
      l.label === 'rotor-1x' || l.label === 'rotor-2x'
        ? [((l.aliasOfHz ?? l.hz) * 60) / (l.label === 'rotor-1x' ? 1 : 2)]
        : [],
    );
    if (rpm.length > 1) {
      const lo = Math.round(Math.min(...rpm) / 100) * 100;
      const hi = Math.round(Math.max(...rpm) / 100) * 100;
      text += ` (rotor speeds about ${lo}–${hi} rpm)`;
    }
    if (cause.orders.length > 1) text += `, ${list(cause.orders.map((o) => ORDER_WORDS[o]))}`;
  }
  return `${text}${lines.length > 1 || cause.channels.length > 1 ? ': one cause, not several' : ''}.`;
}

function rotorMessage(cause: VibrationCause<Member>, top: Member, df: number): string {
  const ms = cause.motors;
  const who =
    ms.length === 1
      ? `motor ${ms[0]}`
      : ms.length
        ? `motor ${list(ms).replace(/ and /, ' or ')}`
        : 'a rotor';
  const order =
    top.label && top.label !== 'frame' ? ORDER_WORDS[top.label] : ORDER_WORDS['rotor-1x'];
  const props =
    ms.length === 1
      ? `motor ${ms[0]}'s prop for a new one`
      : ms.length
        ? `the props on motors ${list(ms)} for new ones`
        : 'each prop for a new one';
  const advice = cause.orders.includes('rotor-1x')
    ? `That is usually an unbalanced or chipped prop or a bent shaft: with the battery out, swap ` +
      `${props}, check the shaft runs true and the bell is not scraped.`
    : cause.orders.includes('rotor-2x')
      ? `That often means a loose motor mount or a prop not seated flat: with the battery out, ` +
        `tighten the motor screws and reseat the props.`
      : `Blade-pass tones grow with nicked or mismatched blades: inspect every blade tip and ` +
        `replace damaged props as a set.`;
  return (
    `Vibration follows ${who} ${order}, strongest at ${Math.round(top.hz)} Hz on ${top.channel} ` +
    `(about ${fmtAmp(top)}). ${seenSentence(cause, df)} ${advice}`
  );
}

function causeFinding(cause: VibrationCause<Member>, th: Thresholds, df: number): Finding | null {
  let severity: Severity | null = null;
  for (const m of cause.members)
    if (m.severity && (!severity || severityRank(m.severity) > severityRank(severity)))
      severity = m.severity;
  if (!severity) return null;
  // The strongest member: the most severe, then the furthest over its own threshold.
  const top = [...cause.members].sort(
    (a, b) =>
      (b.severity ? severityRank(b.severity) + 1 : 0) -
        (a.severity ? severityRank(a.severity) + 1 : 0) || overWatch(b, th) - overWatch(a, th),
  )[0]!;
  const seen = cause.members.map((m) => ({
    channel: m.channel,
    hz: Math.round(m.hz * 100) / 100,
    db: Math.round(m.db * 100) / 100,
    label: m.label,
  }));
  const base = { severity, axis: top.channel, seen };
  const at = `${Math.round(top.hz)} Hz on ${top.channel} (about ${fmtAmp(top)})`;
  switch (cause.kind) {
    case 'rotor':
      return {
        code: 'rotor-harmonic',
        ...base,
        ...(cause.motors.length === 1 ? { motor: cause.motors[0]! } : {}),
        message: rotorMessage(cause, top, df),
      };
    case 'frame':
      return {
        code: 'frame-resonance',
        ...base,
        message:
          `A vibration at ${at} stays put while the motors change speed: something in the frame ` +
          `rings. ${seenSentence(cause, df)} With the battery out, tap arms, standoffs, camera and ` +
          `antenna mounts and listen for a buzz; tighten the stack and frame screws, and check for a cracked arm.`,
      };
    case 'electrical': {
      const alias = Math.round(top.aliasOfHz!);
      return {
        code: 'vibration-peak',
        ...base,
        message:
          `A vibration at ${at} matches the motors' electrical frequency (about ${alias} Hz) ` +
          `folded down by the log rate, so it may be electrical noise rather than shaking; logging ` +
          `at a higher rate tells the two apart. ${seenSentence(cause, df)} With the battery out, ` +
          `route motor wires away from the flight controller, check the capacitor on the power ` +
          `leads, and check the gyro's own filtering on the filter bench.`,
      };
    }
    case 'line':
      return {
        code: 'vibration-peak',
        ...base,
        message:
          `A strong vibration at ${at} that does not match the rotor speed or a fixed frame mode. ` +
          `${seenSentence(cause, df)} With the battery out, check the flight controller's soft ` +
          `mounts and that no wire or strap touches the stack, then look at the filter bench for a notch.`,
      };
  }
}

/** One finding per vibration cause that reaches a severity, loudest cause first. */
export function vibrationFindings(v: VibrationResult, th: Thresholds): Finding[] {
  const members: Member[] = [];
  for (const [channel, ch] of Object.entries(v.channels)) {
    for (const p of ch.peaks) {
      members.push({
        channel,
        hz: p.hz,
        db: p.db,
        label: p.label,
        ...(p.motor !== undefined ? { motor: p.motor } : {}),
        ...(p.candidates?.length ? { candidates: p.candidates } : {}),
        ...(p.aliasOfHz !== undefined ? { aliasOfHz: p.aliasOfHz } : {}),
        amplitude: p.amplitude,
        severity: peakSeverity(p, isGyro(channel), ch.bandRms, othersMedian(v, channel), th),
      });
    }
  }
  return groupPeaks(members, v.df).flatMap((cause) => {
    const f = causeFinding(cause, th, v.df);
    return f ? [f] : [];
  });
}
