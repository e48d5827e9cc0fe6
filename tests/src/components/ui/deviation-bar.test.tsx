// @vitest-environment jsdom
import { cleanup, render } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { DeviationBar } from '../../../../src/components/ui/deviation-bar';
import { motorOutline } from '../../../../src/components/charts/palette';
import { palette } from '../../../../src/components/ui/palette';

afterEach(cleanup);

function bar(motor: number, pct: number): HTMLElement {
  const { container } = render(<DeviationBar motor={motor} pct={pct} className="h-2 w-24" />);
  return container.querySelector<HTMLElement>(`[data-deviation-bar="${motor}"]`)!;
}

describe('motor deviation bar (Compare and Balance)', () => {
  it('outlines the bar in ink where the motor colour is under 3:1 on paper', () => {
    // Motor 1 is orange, motor 4 yellow: both faint on paper (WCAG 2.1 §1.4.11).
    for (const n of [1, 4]) {
      expect(motorOutline(n)).toBe(palette.ink.DEFAULT);
      expect(bar(n, 5).style.boxShadow, `motor ${n}`).toContain('inset 0 0 0 1px');
      cleanup();
    }
  });

  it('leaves a colour that reads on its own without an outline', () => {
    // Motor 5 (blue) and 6 (vermilion) read at 3:1 or more on every paper.
    for (const n of [5, 6]) {
      expect(bar(n, 5).style.boxShadow, `motor ${n}`).toBe('');
      cleanup();
    }
  });

  it('grows either side of the centre and stops at full scale', () => {
    const up = bar(2, 10);
    expect([up.style.left, up.style.width]).toEqual(['50%', '25%']);
    cleanup();
    const down = bar(2, -40);
    expect([down.style.left, down.style.width]).toEqual(['0%', '50%']);
  });
});
