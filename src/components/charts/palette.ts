import { contrast } from '../ui/contrast';
import { palette } from '../ui/palette';

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
  /** A flight that raised drift, on the trend charts. */
  drift: '#b4411e',
  grid: '#e6e1d6',
  axis: '#4a5866',
} as const;

/** The paper tones a chart or a swatch is drawn on. */
const papers = [palette.paper.DEFAULT, palette.paper.raised, palette.paper.sunk];

/**
 * WCAG 2.1 §1.4.11 (non-text contrast) asks 3:1 of a mark against what is around it; a colour
 * under that on some paper gets an ink outline so the shape reads while the fill keeps its colour.
 */
const underThreeToOne = (colour: string) => papers.some((bg) => contrast(colour, bg) < 3);

/**
 * Motor colours under 3:1 against the paper tones: orange, sky blue, bluish green, yellow and
 * reddish purple; `tests/src/components/palette.test.ts` names them.
 */
export const lowContrastMotorColours: ReadonlySet<string> = new Set(
  okabeIto.filter(underThreeToOne),
);

/**
 * The outline for a mark in `colour` (a `#rrggbb` motor colour or any other chart colour): ink
 * where the colour alone is under 3:1 on paper, else none.
 */
export function outlineFor(colour: string): string | undefined {
  return underThreeToOne(colour) ? palette.ink.DEFAULT : undefined;
}

/** The outline for motor `n`'s markers. */
export const motorOutline = (n: number) => outlineFor(motorColor(n));

/**
 * An echarts series' marker style: filled circles (the legend draws one on each line's icon),
 * outlined in ink where the colour alone is under 3:1 on paper.
 */
export function seriesMarker(colour: string) {
  const outline = outlineFor(colour);
  return {
    symbol: 'circle',
    itemStyle: outline
      ? { color: colour, borderColor: outline, borderWidth: 1 }
      : { color: colour },
  };
}
