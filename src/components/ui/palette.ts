/**
 * The app's colours, one source for Tailwind's tokens and for the SVG and chart code that
 * cannot use class names. Warm paper, deep slate ink, one amber accent for "look here".
 *
 * Every text token reads at 4.5:1 or more on every paper tone (WCAG 2.1 AA, §1.4.3), and the
 * control border reads at 3:1 (§1.4.11); `tests/src/components/palette.test.ts` checks each
 * pair with the WCAG 2.1 relative-luminance formula. `accent` itself is the amber for fills,
 * strokes and the chart cursor; text in amber uses `accent.ink`. `line` is for decorative
 * rules between things that are already told apart by their text; anything a person must find
 * to operate (inputs, buttons) is outlined in `line.strong`.
 */
export const palette = {
  paper: { DEFAULT: '#f7f5f0', raised: '#ffffff', sunk: '#eeebe3' },
  ink: { DEFAULT: '#1c2733', soft: '#4a5866', faint: '#5c6773' },
  slate: { brand: '#1f3a4d' },
  line: { DEFAULT: '#dcd7cc', strong: '#857f72' },
  accent: { DEFAULT: '#c7771a', ink: '#8f5a0b', soft: '#f6e3c8' },
  sev: { note: '#325a72', watch: '#8a5a10', act: '#a63c35' },
  ok: '#276a4c',
} as const;
