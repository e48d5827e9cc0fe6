// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it } from 'vitest';
import { judgeAgainst } from '../../../../../shared/analysis/baseline';
import type { BaselineFlight, DriftSample } from '../../../../../shared/schemas/baseline';
import { defaultThresholds } from '../../../../../shared/schemas/thresholds';
import { DriftLine } from '../../../../../src/features/review/components/drift-line';
import { VerdictList } from '../../../../../src/features/review/components/verdict-list';
import { withDrift } from '../../../../../src/features/review/model/with-drift';

afterEach(cleanup);

const sample = (deviationPct: number[]): DriftSample => ({
  hoverS: 20,
  deviationPct,
  asymmetryPct: 0,
  cg: null,
  bandRms: {},
  internalResistanceOhm: null,
  lagMs: null,
});
const earlier: BaselineFlight[] = [1, 2, 3, 4, 5, 6].map((n) => ({
  flightId: `00000000-0000-4000-8000-00000000000${n}`,
  recordedAt: `2026-12-0${n}T09:00:00.000Z`,
  sample: sample([0.2, -0.1 + n * 0.02, 0, -0.1]),
}));
const since = { date: '2026-12-01', kind: 'part-swap' as const, motor: 2, note: 'new motor 2' };

describe('the line under the verdict that says what drift compared with', () => {
  it('names the aircraft, the flights and the service entry, and the drift finding joins the verdict', () => {
    const outcome = judgeAgainst(
      sample([0.2, 4.1, 0, -0.1]),
      '2026-12-07T10:00:00.000Z',
      { aircraftName: 'Kite', since, flights: earlier, shortHover: 0 },
      defaultThresholds,
    );
    render(
      <MemoryRouter>
        <VerdictList
          flightId="3f1c9a52-8c1e-4c57-9a0e-6b7f2d1e4a10"
          findings={withDrift([], outcome)}
          hoverS={20}
          comparedWith={<DriftLine outcome={outcome} />}
        />
      </MemoryRouter>,
    );
    expect(screen.getByTestId('drift-line').textContent).toBe(
      'Drift judged against Kite’s last 6 flights, since the motor 2 swap on 1 Dec: 1 change beyond its usual flight-to-flight spread, listed above.',
    );
    const list = screen.getByRole('list', { name: 'Findings' });
    expect(within(list).getByText(/Motor 2 now works 4\.\d points harder/)).toBeTruthy();
  });

  it('says why there was no baseline', () => {
    render(
      <DriftLine
        outcome={judgeAgainst(
          sample([0, 0, 0, 0]),
          '2026-12-07T10:00:00.000Z',
          { aircraftName: 'Kite', since, flights: earlier.slice(0, 1), shortHover: 0 },
          defaultThresholds,
        )}
      />,
    );
    expect(screen.getByTestId('drift-line').textContent).toBe(
      'No drift: Kite has 1 earlier flight with enough hover, since the motor 2 swap on 1 Dec; it takes 3.',
    );
  });

  it('says it is still looking while the baseline loads', () => {
    render(<DriftLine outcome={null} />);
    expect(screen.getByTestId('drift-line').textContent).toMatch(
      /looking for this aircraft’s recent flights/,
    );
  });
});
