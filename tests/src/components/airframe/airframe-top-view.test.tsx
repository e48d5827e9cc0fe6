// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { defaultQuadX, presetAirframe } from '../../../../shared/airframe/presets';
import type { Airframe } from '../../../../shared/schemas/airframe';
import {
  AirframeTopView,
  type AirframeTopViewProps,
} from '../../../../src/components/airframe/airframe-top-view';
import { motorColor, motorOutline } from '../../../../src/components/charts/palette';

afterEach(cleanup);

const motor = (n: number) => document.querySelector(`[data-motor="${n}"]`)!;
const centre = (n: number) => {
  // The prop disc is the first circle of a motor that is not the dashed verdict ring.
  const discs = [...motor(n).querySelectorAll('circle')].filter(
    (c) => !c.getAttribute('stroke-dasharray'),
  );
  return { cx: Number(discs[0]!.getAttribute('cx')), cy: Number(discs[0]!.getAttribute('cy')) };
};
const draw = (airframe: Airframe, more: Partial<AirframeTopViewProps> = {}) =>
  render(
    <AirframeTopView
      motors={airframe.motors}
      propDiameterIn={airframe.prop.diameterIn}
      {...more}
    />,
  );

describe('airframe top view', () => {
  it('draws nose up and right side right: motor 1 front-right, motor 3 rear-left', () => {
    draw(defaultQuadX);
    // FRD: x forward → screen up (negative y), y right → screen right (positive x).
    expect(centre(1).cx).toBeGreaterThan(0);
    expect(centre(1).cy).toBeLessThan(0);
    expect(centre(3).cx).toBeLessThan(0);
    expect(centre(3).cy).toBeGreaterThan(0);
    expect(screen.getByRole('img', { name: 'Top view: 4 motors, nose up' })).toBeTruthy();
  });

  it('puts the design CG and the estimate through the same transform as the motors', () => {
    draw(defaultQuadX, { designCg: { x: 10, y: -4 }, estimatedCg: { xMm: -6, yMm: 3 } });
    const ring = document.querySelector('[data-design-cg]')!;
    // 10 mm forward, 4 mm left → 10 up (−y on screen), 4 left (−x on screen).
    expect(Number(ring.getAttribute('cx'))).toBe(-4);
    expect(Number(ring.getAttribute('cy'))).toBe(-10);
    const cross = [...document.querySelectorAll('[data-estimated-cg] line')];
    const vertical = cross.find((l) => l.getAttribute('x1') === l.getAttribute('x2'))!;
    // 6 mm aft, 3 mm right → 6 down, 3 right.
    expect(Number(vertical.getAttribute('x1'))).toBe(3);
    const horizontal = cross.find((l) => l.getAttribute('y1') === l.getAttribute('y2'))!;
    expect(Number(horizontal.getAttribute('y1'))).toBe(6);
  });

  it('rings the flagged motors and prints each deviation, to 0.1 % with no sign at zero', () => {
    draw(defaultQuadX, { deviationPct: [-1.2, 0.01, 11.84, -0.4], flagged: new Set([3]) });
    expect(motor(3).getAttribute('data-flagged')).toBe('true');
    expect(motor(1).getAttribute('data-flagged')).toBe('false');
    expect(motor(3).querySelector('circle[stroke-dasharray]')).toBeTruthy();
    expect(motor(1).querySelector('circle[stroke-dasharray]')).toBeNull();
    const tip = (n: number) => motor(n).querySelector('title')!.textContent;
    expect(tip(3)).toBe('Motor 3, ccw, deviation +11.8 %, named in the verdict');
    expect(tip(2)).toContain('deviation 0.0 %');
    expect(tip(1)).toContain('deviation −1.2 %');
    expect(motor(3).textContent).toContain('+11.8 %');
  });

  it('without deviations, each motor tells its position to 0.1 mm', () => {
    draw({
      ...defaultQuadX,
      motors: [{ x: 77.78174593, y: 77.78174593, spin: 'ccw' }, ...defaultQuadX.motors.slice(1)],
    });
    expect(motor(1).querySelector('title')!.textContent).toBe('Motor 1: x 77.8 mm, y 77.8 mm, ccw');
  });

  it('turns each spin arrow the way its prop spins, seen from above', () => {
    draw(defaultQuadX);
    // SVG arc sweep-flag 1 runs clockwise on screen (y down), which is clockwise seen from above.
    const sweep = (n: number) => motor(n).querySelector('path')!.getAttribute('d')!.split(/\s+/)[8];
    expect(sweep(1)).toBe('0'); // ccw
    expect(sweep(2)).toBe('1'); // cw
  });

  it('gives every motor of a hexacopter its own colour, outlined in ink where it is faint', () => {
    draw(presetAirframe('hex-x'));
    for (let n = 1; n <= 6; n++) {
      const disc = [...motor(n).querySelectorAll('circle')].find(
        (c) => c.getAttribute('stroke') === motorColor(n),
      );
      expect(disc, `motor ${n}`).toBeTruthy();
      const outline = motor(n).querySelector('circle[data-outline]');
      if (motorOutline(n))
        expect(outline?.getAttribute('stroke'), `motor ${n}`).toBe(motorOutline(n));
      else expect(outline, `motor ${n}`).toBeNull();
    }
    // Orange (1) and yellow (4) are outlined; blue (5) and vermilion (6) are not.
    expect(motor(1).querySelector('circle[data-outline]')).toBeTruthy();
    expect(motor(4).querySelector('circle[data-outline]')).toBeTruthy();
    expect(motor(5).querySelector('circle[data-outline]')).toBeNull();
  });

  it('skips motors whose position is not a number yet (while typing) but counts them', () => {
    draw({
      ...defaultQuadX,
      motors: [...defaultQuadX.motors.slice(0, 3), { x: NaN, y: 10, spin: 'cw' }],
    });
    expect(document.querySelectorAll('[data-motor]')).toHaveLength(3);
    expect(screen.getByRole('img', { name: 'Top view: 4 motors, nose up' })).toBeTruthy();
  });
});
