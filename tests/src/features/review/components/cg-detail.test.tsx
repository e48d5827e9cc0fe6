// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { CgDetail } from '../../../../../src/features/review/components/cg-detail';

afterEach(cleanup);

describe('CG detail', () => {
  it('shows a CG offset forward of the design CG above it, and one to the left on the left', () => {
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

  it('measures from the design CG, not the frame centre', () => {
    render(<CgDetail cg={{ xMm: 13, yMm: 5 }} design={{ x: 10, y: 5 }} />);
    const line = document.querySelector('line[stroke-dasharray]')!;
    expect(Number(line.getAttribute('x2'))).toBe(0);
    expect(Number(line.getAttribute('y2'))).toBe(-3);
  });
});
