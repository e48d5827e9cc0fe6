// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { defaultQuadX, presetAirframe } from '../../../../../shared/airframe/presets';
import { CgDetail, TopView } from '../../../../../src/features/review/components/top-view';
import { motorColor } from '../../../../../src/components/charts/palette';

afterEach(cleanup);

const motor = (n: number) => document.querySelector(`[data-motor="${n}"]`)!;
const hub = (n: number) => {
  // The prop disc is the first circle of a motor that is not the dashed verdict ring.
  const discs = [...motor(n).querySelectorAll('circle')].filter(
    (c) => !c.getAttribute('stroke-dasharray'),
  );
  return { cx: Number(discs[0]!.getAttribute('cx')), cy: Number(discs[0]!.getAttribute('cy')) };
};

describe('top view', () => {
  it('draws nose up and right side right: motor 1 front-right, motor 3 rear-left', () => {
    render(
      <TopView airframe={defaultQuadX} deviationPct={[0, 0, 0, 0]} cg={null} flagged={new Set()} />,
    );
    // FRD: x forward → screen up (negative y), y right → screen right (positive x).
    expect(hub(1).cx).toBeGreaterThan(0);
    expect(hub(1).cy).toBeLessThan(0);
    expect(hub(3).cx).toBeLessThan(0);
    expect(hub(3).cy).toBeGreaterThan(0);
  });

  it('rings the motors the verdict names and prints each deviation', () => {
    render(
      <TopView
        airframe={defaultQuadX}
        deviationPct={[-1.2, 0.01, 11.84, -0.4]}
        cg={null}
        flagged={new Set([3])}
      />,
    );
    expect(screen.getByRole('img', { name: /motor 3 marked/ })).toBeTruthy();
    expect(motor(3).getAttribute('data-flagged')).toBe('true');
    expect(motor(1).getAttribute('data-flagged')).toBe('false');
    const tip = (n: number) => motor(n).querySelector('title')!.textContent;
    expect(tip(3)).toBe('Motor 3, ccw, deviation +11.8 %, named in the verdict');
    // Rounded to zero shows no sign.
    expect(tip(2)).toContain('deviation 0.0 %');
    expect(tip(1)).toContain('deviation −1.2 %');
    // The image's own name carries every figure, since its parts are not read out.
    expect(
      screen.getByRole('img', {
        name: /Deviation from expected hover output: motor 1 −1\.2 %, motor 2 0\.0 %, motor 3 \+11\.8 %, motor 4 −0\.4 %$/,
      }),
    ).toBeTruthy();
  });

  it('turns each spin arrow the way its prop spins, seen from above', () => {
    render(
      <TopView airframe={defaultQuadX} deviationPct={[0, 0, 0, 0]} cg={null} flagged={new Set()} />,
    );
    // SVG arc sweep-flag 1 runs clockwise on screen (y down), which is clockwise seen from above.
    const sweep = (n: number) => motor(n).querySelector('path')!.getAttribute('d')!.split(/\s+/)[8];
    expect(sweep(1)).toBe('0'); // ccw
    expect(sweep(2)).toBe('1'); // cw
  });

  it('gives every motor of a hexacopter its own palette colour', () => {
    render(
      <TopView
        airframe={presetAirframe('hex-x')}
        deviationPct={[0, 0, 0, 0, 0, 0]}
        cg={null}
        flagged={new Set()}
      />,
    );
    for (let n = 1; n <= 6; n++) {
      const disc = [...motor(n).querySelectorAll('circle')].find(
        (c) => c.getAttribute('stroke') === motorColor(n),
      );
      expect(disc, `motor ${n}`).toBeTruthy();
    }
  });

  it('shows a CG offset forward of the design CG above it in the detail', () => {
    render(<CgDetail cg={{ xMm: 6, yMm: -2 }} design={{ x: 0, y: 0 }} />);
    const line = document.querySelector('line[stroke-dasharray]')!;
    expect(Number(line.getAttribute('x2'))).toBe(-2);
    expect(Number(line.getAttribute('y2'))).toBe(-6);
    expect(
      screen.getByRole('img', {
        name: 'CG detail, ±10 mm: estimate +6.0 mm forward, −2.0 mm right of the design CG',
      }),
    ).toBeTruthy();
  });
});
