// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it } from 'vitest';
import { groupPeaks, type GroupablePeak } from '../../../../../../shared/analysis/vibration-groups';
import { VibrationPeakTable } from '../../../../../../src/features/review/components/sections/vibration-peak-table';

afterEach(cleanup);

const df = 3.90625;
const peaks: GroupablePeak[] = [
  { channel: 'gyro_x', hz: 188.7, db: 12, label: 'rotor-1x', motor: 2 },
  { channel: 'gyro_y', hz: 188.7, db: 11.9, label: 'rotor-1x', motor: 2 },
  { channel: 'gyro_x', hz: 321.1, db: -3.2, label: 'rotor-1x', motor: 2 },
  { channel: 'gyro_z', hz: 172.9, db: -6.6, label: 'rotor-1x', motor: 2 },
  { channel: 'gyro_x', hz: 289.6, db: -0.3, label: 'frame' },
];

function renderTable() {
  render(<VibrationPeakTable causes={groupPeaks(peaks, df)} unit="(deg/s)²/Hz" />);
  return screen.getByRole('table', { name: 'Vibration peaks' });
}

describe('grouped vibration peak table', () => {
  it('shows one group row per cause, with where it was seen, its span and its loudest level', () => {
    const table = renderTable();
    const groups = within(table).getAllByRole('rowheader');
    expect(groups.map((g) => g.textContent)).toEqual([
      expect.stringMatching(/Motor 2: rotor 1× .*4 peaks on gyro_x, gyro_y, gyro_z/),
      expect.stringMatching(/Frame mode near 290 Hz.*on gyro_x/),
    ]);
    const rotorRow = groups[0]!.closest('tr')!;
    expect(rotorRow.textContent).toContain('173–321 Hz');
    expect(rotorRow.textContent).toContain('12.0');
    // Members stay folded until asked for.
    expect(within(table).queryByText('321.1 Hz')).toBeNull();
  });

  it('says what the level is relative to', () => {
    const table = renderTable();
    const header = within(table).getByRole('columnheader', { name: /Level/ });
    expect(header.textContent).toContain('dB re 1 (deg/s)²/Hz');
  });

  it('opens a group from the keyboard and lists its members', async () => {
    const user = userEvent.setup();
    const table = renderTable();
    const toggle = within(table).getByRole('button', { name: /Motor 2/ });
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    await user.tab();
    expect(document.activeElement).toBe(toggle);
    await user.keyboard('{Enter}');
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
    for (const hz of ['188.7 Hz', '321.1 Hz', '172.9 Hz'])
      expect(within(table).getAllByText(hz).length).toBeGreaterThan(0);
    const ids = toggle.getAttribute('aria-controls')!.split(' ');
    expect(ids).toHaveLength(4);
    for (const id of ids) expect(document.getElementById(id)).not.toBeNull();
    await user.keyboard(' ');
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    expect(within(table).queryByText('321.1 Hz')).toBeNull();
  });

  it('a cause seen once has no toggle, and no peaks say so', () => {
    renderTable();
    expect(screen.queryByRole('button', { name: /Frame mode/ })).toBeNull();
    cleanup();
    render(<VibrationPeakTable causes={[]} unit="g²/Hz" />);
    expect(screen.getByText('No peak stands out of the noise floor.')).toBeTruthy();
    expect(screen.getByRole('columnheader', { name: /Level/ }).textContent).toContain(
      'dB re 1 g²/Hz',
    );
  });
});
