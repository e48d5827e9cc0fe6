/**
 * Okabe & Ito (2008), "Color Universal Design": eight colours that stay apart for the common
 * colour-vision deficiencies. Motor N always gets entry N−1 (cycling past eight), on every
 * chart and on the top view, and motor colours are used for motors only.
 */
export const okabeIto = [
  '#E69F00',
  '#56B4E9',
  '#009E73',
  '#F0E442',
  '#0072B2',
  '#D55E00',
  '#CC79A7',
  '#000000',
] as const;

/** Colour of 1-based motor `n`. */
export function motorColor(n: number): string {
  const i = (((n - 1) % okabeIto.length) + okabeIto.length) % okabeIto.length;
  return okabeIto[i]!;
}

/** Non-motor series: ink tones and the brand slate, so they never read as a motor. */
export const inkSeries = {
  collective: '#1f3a4d',
  throttle: '#7d8894',
  roll: '#3f6e8c',
  pitch: '#8a5a2b',
  yaw: '#6b4c7a',
  setpoint: '#7d8894',
  measured: '#1f3a4d',
  before: '#9aa3ad',
  after: '#1f3a4d',
  band: 'rgba(47,125,91,0.10)',
  cursor: '#c7771a',
  grid: '#e6e1d6',
  axis: '#4a5866',
} as const;
