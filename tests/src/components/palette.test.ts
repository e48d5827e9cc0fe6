import { describe, expect, it } from 'vitest';
import { contrast, rgb } from '../../../src/components/ui/contrast';
import { palette } from '../../../src/components/ui/palette';
import {
  lowContrastMotorColours,
  motorOutline,
  okabeIto,
  outlineFor,
} from '../../../src/components/charts/palette';

/** A colour laid over a background at an opacity, as Tailwind's `bg-x/15` paints it. */
function over(fg: string, alpha: number, bg: string): string {
  const f = rgb(fg);
  const b = rgb(bg);
  return (
    '#' +
    f
      .map((c, i) =>
        Math.round(c * alpha + b[i]! * (1 - alpha))
          .toString(16)
          .padStart(2, '0'),
      )
      .join('')
  );
}

const papers = {
  paper: palette.paper.DEFAULT,
  raised: palette.paper.raised,
  sunk: palette.paper.sunk,
  'accent soft': palette.accent.soft,
};

// The ratio is WCAG 2.1's "relative luminance" and "contrast ratio" (src/components/ui/contrast.ts).
describe('contrast formula', () => {
  it('matches the end points and a known grey', () => {
    // WCAG 2.1 §1.4.3 understanding: ratios run from 1:1 to 21:1 (black on white).
    expect(contrast('#000000', '#ffffff')).toBeCloseTo(21, 6);
    expect(contrast('#777777', '#777777')).toBe(1);
    // From memory: #767676 is the lightest grey that passes 4.5:1 on white (4.54:1), #777777
    // just fails (4.48:1).
    expect(contrast('#767676', '#ffffff')).toBeCloseTo(4.54, 2);
    expect(contrast('#777777', '#ffffff')).toBeCloseTo(4.48, 2);
  });
});

describe('palette meets WCAG 2.1 AA', () => {
  const text = {
    ink: palette.ink.DEFAULT,
    'ink soft': palette.ink.soft,
    'ink faint': palette.ink.faint,
    'slate brand': palette.slate.brand,
    'accent ink': palette.accent.ink,
    note: palette.sev.note,
    watch: palette.sev.watch,
    act: palette.sev.act,
    ok: palette.ok,
  };
  for (const [fg, fgHex] of Object.entries(text))
    for (const [bg, bgHex] of Object.entries(papers))
      it(`${fg} text on ${bg} reads at 4.5:1 or more (§1.4.3)`, () => {
        expect(contrast(fgHex, bgHex)).toBeGreaterThanOrEqual(4.5);
      });

  it('filled severity chips and the primary button keep paper text at 4.5:1 (§1.4.3)', () => {
    for (const fill of [palette.sev.act, palette.sev.watch, palette.slate.brand, palette.ink.faint])
      expect(contrast(palette.paper.DEFAULT, fill), fill).toBeGreaterThanOrEqual(4.5);
  });

  it('the tinted note chip keeps its text at 4.5:1 on every paper (§1.4.3)', () => {
    for (const bg of Object.values(papers))
      expect(
        contrast(palette.sev.note, over(palette.sev.note, 0.15, bg)),
        bg,
      ).toBeGreaterThanOrEqual(4.5);
  });

  it('control borders and the amber accent mark read at 3:1 on paper and white (§1.4.11)', () => {
    for (const bg of [palette.paper.DEFAULT, palette.paper.raised, palette.paper.sunk])
      expect(contrast(palette.line.strong, bg), bg).toBeGreaterThanOrEqual(3);
    for (const bg of [palette.paper.DEFAULT, palette.paper.raised])
      expect(contrast(palette.accent.DEFAULT, bg), bg).toBeGreaterThanOrEqual(3);
  });
});

describe('motor markers (§1.4.11)', () => {
  const papers3 = [palette.paper.DEFAULT, palette.paper.raised, palette.paper.sunk];
  it('outlines exactly the motor colours that fall under 3:1 on some paper', () => {
    const under = okabeIto.filter((c) => papers3.some((bg) => contrast(c, bg) < 3));
    expect([...lowContrastMotorColours].sort()).toEqual([...under].sort());
    // Orange, sky blue, bluish green, yellow and reddish purple (Okabe & Ito 2008 names).
    expect([...lowContrastMotorColours].sort()).toEqual(
      ['#E69F00', '#56B4E9', '#009E73', '#F0E442', '#CC79A7'].sort(),
    );
  });

  it('outlines any other chart colour that is faint on paper, whatever its case', () => {
    // The blade-pass order line is drawn in paper over the dark heatmap; its legend icon is not.
    expect(outlineFor(palette.paper.DEFAULT)).toBe(palette.ink.DEFAULT);
    expect(outlineFor('#e69f00')).toBe(palette.ink.DEFAULT);
    expect(outlineFor(palette.sev.act)).toBeUndefined();
  });

  it('the outline itself reads at 3:1 on every paper, and motors past eight cycle with it', () => {
    for (let n = 1; n <= 9; n++) {
      const outline = motorOutline(n);
      if (!outline) continue;
      for (const bg of papers3)
        expect(contrast(outline, bg), `motor ${n} on ${bg}`).toBeGreaterThanOrEqual(3);
    }
    // Motor 1 (orange) needs one, motor 5 (blue, 4.4:1 on sunk paper) does not; motor 9 is motor 1.
    expect(motorOutline(1)).toBeDefined();
    expect(motorOutline(5)).toBeUndefined();
    expect(motorOutline(9)).toBe(motorOutline(1));
  });
});
