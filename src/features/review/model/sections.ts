import { mostSevereFirst, type Finding, type FindingCode } from '../../../../shared/schemas/report';

export type SectionId =
  | 'effort'
  | 'balance'
  | 'torque'
  | 'vibration'
  | 'filters'
  | 'power'
  | 'headroom'
  | 'tracking'
  | 'compare';

export interface SectionInfo {
  id: SectionId;
  label: string;
  /** One line under the heading: what the section answers. */
  question: string;
}

export const sections: SectionInfo[] = [
  {
    id: 'balance',
    label: 'Balance',
    question: 'Does each motor carry what the airframe says it should, and where is the CG?',
  },
  {
    id: 'torque',
    label: 'Torque split',
    question: 'Do the clockwise and counter-clockwise props share the yaw torque evenly?',
  },
  {
    id: 'effort',
    label: 'Effort',
    question: 'What did the mixer ask of the motors: collective, roll, pitch and yaw?',
  },
  {
    id: 'vibration',
    label: 'Vibration',
    question: 'Which peaks shake the frame, and do they follow the rotors or sit still?',
  },
  {
    id: 'filters',
    label: 'Filter bench',
    question: 'What would a low-pass or notch do to this flight’s gyro, and at what delay?',
  },
  {
    id: 'power',
    label: 'Power',
    question: 'How far did the pack sag, and how much did the flight use?',
  },
  {
    id: 'headroom',
    label: 'Headroom',
    question: 'Did motors run out of room, and did the ESCs stay within their rating?',
  },
  {
    id: 'tracking',
    label: 'Tracking',
    question: 'How closely did the gyro follow the setpoint, and how late?',
  },
  {
    id: 'compare',
    label: 'Compare',
    question: 'What changed against another flight of the same aircraft?',
  },
];

export function isSectionId(s: string | undefined): s is SectionId {
  return sections.some((x) => x.id === s);
}

const sectionOfCode: Record<FindingCode, SectionId> = {
  'motor-working-hard': 'balance',
  'cg-offset': 'balance',
  'torque-split': 'torque',
  'vibration-peak': 'vibration',
  'rotor-harmonic': 'vibration',
  'frame-resonance': 'vibration',
  'motor-saturation': 'headroom',
  'esc-overcurrent': 'headroom',
  'battery-sag': 'power',
  'tracking-lag': 'tracking',
  'log-gap': 'effort',
  'motor-drift': 'balance',
  'vibration-drift': 'vibration',
  'pack-ageing': 'power',
  'response-drift': 'tracking',
};

/** Where the evidence for a finding is drawn. */
export function sectionForFinding(f: Pick<Finding, 'code'>): SectionId {
  return sectionOfCode[f.code];
}

/** Most severe first; within a severity the engine's own order (it ranks by size) is kept. */
export function rankFindings(findings: readonly Finding[]): Finding[] {
  return findings
    .map((f, i) => ({ f, i }))
    .sort((a, b) => mostSevereFirst(a.f, b.f) || a.i - b.i)
    .map((x) => x.f);
}

/** The section to open when the link names none: the evidence of the worst finding. */
export function defaultSection(findings: readonly Finding[]): SectionId {
  const top = rankFindings(findings)[0];
  return top ? sectionForFinding(top) : 'balance';
}
