// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Finding } from '../../../../../shared/schemas/report';
import { VerdictList } from '../../../../../src/features/review/components/verdict-list';

afterEach(cleanup);

const flightId = '3f1c9a52-8c1e-4c57-9a0e-6b7f2d1e4a10';
const findings: Finding[] = [
  {
    code: 'vibration-peak',
    severity: 'note',
    axis: 'gyro_x',
    message: 'A small peak near 180 Hz on roll.',
  },
  {
    code: 'battery-sag',
    severity: 'watch',
    tS: 51.2,
    message: 'Cells sagged to 3.45 V under load.',
  },
  {
    code: 'motor-working-hard',
    severity: 'act',
    motor: 3,
    tS: 12.5,
    message: 'Works 14 % harder than the frame predicts in hover.',
  },
  { code: 'cg-offset', severity: 'watch', message: 'The CG sits 9 mm forward of the design CG.' },
];

function renderList(list: Finding[] = findings, onSelect = vi.fn()) {
  render(
    <MemoryRouter>
      <VerdictList flightId={flightId} findings={list} hoverS={22.4} onSelect={onSelect} />
    </MemoryRouter>,
  );
  return onSelect;
}

describe('verdict list', () => {
  it('ranks findings act, then watch, then note, keeping the engine order within a severity', () => {
    renderList();
    const items = within(screen.getByRole('list', { name: 'Findings' })).getAllByRole('listitem');
    expect(items.map((li) => li.textContent)).toEqual([
      expect.stringMatching(/Motor 3:\s*Works 14 %/),
      expect.stringContaining('Cells sagged'),
      expect.stringContaining('The CG sits 9 mm'),
      expect.stringContaining('A small peak near 180 Hz'),
    ]);
    expect(within(items[0]!).getByText('Act')).toBeTruthy();
    expect(within(items[3]!).getByText('Note')).toBeTruthy();
    expect(screen.getByText(/1 act · 2 watch · 1 note · 22\.4 s of hover/)).toBeTruthy();
  });

  it('names the motor and links each finding to its evidence at its moment', () => {
    renderList();
    const items = within(screen.getByRole('list', { name: 'Findings' })).getAllByRole('listitem');
    expect(within(items[0]!).getByText('Motor 3:')).toBeTruthy();
    expect(within(items[0]!).getByRole('link').getAttribute('href')).toBe(
      `/flights/${flightId}/balance?t=12.5`,
    );
    expect(within(items[1]!).getByRole('link').getAttribute('href')).toBe(
      `/flights/${flightId}/power?t=51.2`,
    );
    // No moment: the link opens the section without moving the cursor.
    expect(within(items[3]!).getByRole('link').getAttribute('href')).toBe(
      `/flights/${flightId}/vibration`,
    );
  });

  it('does not name the motor twice when the message already does', () => {
    renderList([
      {
        code: 'motor-saturation',
        severity: 'note',
        motor: 2,
        tS: 3,
        message: 'Motor 2 hit its limit for 0.4 s.',
      },
    ]);
    const item = within(screen.getByRole('list', { name: 'Findings' })).getByRole('listitem');
    expect(item.textContent).not.toContain('Motor 2:');
    expect(item.textContent).toContain('Motor 2 hit its limit');
  });

  it('hands the chosen finding to the page so the cursor can move there', async () => {
    const onSelect = renderList();
    await userEvent
      .setup()
      .click(screen.getByRole('link', { name: /Balance evidence at 12\.50 s/ }));
    expect(onSelect).toHaveBeenCalledWith(findings[2]);
  });

  it('says plainly when nothing stood out, without calling the aircraft healthy', () => {
    renderList([]);
    expect(screen.queryByRole('list', { name: 'Findings' })).toBeNull();
    expect(screen.getByText(/Nothing in this log stood out/).textContent).toContain(
      'not a clean bill of health',
    );
    expect(screen.getByText(/Findings are advice/)).toBeTruthy();
  });
});
