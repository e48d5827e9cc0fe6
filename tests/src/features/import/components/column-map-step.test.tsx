// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { proposeColumnMap } from '../../../../../shared/log/propose-column-map';
import { ColumnMapStep } from '../../../../../src/features/import/components/column-map-step';

afterEach(cleanup);

// A header layout of our own invention, as a different flight-controller export might write it.
const headers = [
  'Timestamp (ms)',
  'Out0',
  'Out1',
  'Out2',
  'Out3',
  'GyroRoll (dps)',
  'Battery (V)',
  'Notes',
];
const sample = [['0', '1100', '1110', '1090', '1105', '0.5', '16.4', 'x']];

function setup(overrides: Partial<Parameters<typeof ColumnMapStep>[0]> = {}) {
  const onConfirm = vi.fn();
  const onCancel = vi.fn();
  render(
    <ColumnMapStep
      fileName="kite-export.csv"
      proposal={proposeColumnMap(headers)}
      sampleRows={sample}
      canSavePreset={false}
      onConfirm={onConfirm}
      onCancel={onCancel}
      {...overrides}
    />,
  );
  return { onConfirm, onCancel, user: userEvent.setup() };
}

const channelOf = (header: string) =>
  screen.getByLabelText(`Channel for ${header}`) as HTMLSelectElement;
const unitOf = (header: string) => screen.getByLabelText(`Unit for ${header}`) as HTMLSelectElement;

describe('column-map step', () => {
  it('shows the proposed channel and unit for each column, with the first values of the file', () => {
    setup();
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(headers.length + 1);
    expect(channelOf('Timestamp (ms)').value).toBe('time');
    expect(unitOf('Timestamp (ms)').value).toBe('ms');
    // Numbered from 0 in the file, from 1 in ours.
    expect(channelOf('Out0').value).toBe('motor1');
    expect(channelOf('GyroRoll (dps)').value).toBe('gyro_x');
    expect(channelOf('Notes').value).toBe('');
    expect(screen.getByText('1100')).toBeTruthy();
  });

  it('refuses a map that uses one channel twice and says which columns clash', async () => {
    const { onConfirm, user } = setup();
    await user.selectOptions(channelOf('Out1'), 'motor1');
    await user.click(screen.getByRole('button', { name: 'Read with this map' }));
    expect(screen.getByRole('alert').textContent).toContain(
      'motor1 is chosen for both "Out0" and "Out1"',
    );
    expect(onConfirm).not.toHaveBeenCalled();
  });

  it('asks for the raw range when a motor column is raw, then hands over a valid map', async () => {
    const { onConfirm, user } = setup();
    for (const h of ['Out0', 'Out1', 'Out2', 'Out3']) await user.selectOptions(unitOf(h), 'raw');
    await user.click(screen.getByRole('button', { name: 'Read with this map' }));
    expect(screen.getByRole('alert').textContent).toContain(
      '"Out0" is raw: give the value at 0 % and at 100 % output.',
    );
    expect(onConfirm).not.toHaveBeenCalled();

    for (const h of ['Out0', 'Out1', 'Out2', 'Out3']) {
      await user.type(screen.getByLabelText(`Raw value at 0 % for ${h}`), '1000');
      await user.type(screen.getByLabelText(`Raw value at 100 % for ${h}`), '2000');
    }
    await user.click(screen.getByRole('button', { name: 'Read with this map' }));
    expect(onConfirm).toHaveBeenCalledTimes(1);
    const [map, preset] = onConfirm.mock.calls[0]!;
    expect(preset).toBeNull();
    expect(map.columns['Out2']).toEqual({ channel: 'motor3', unit: 'raw', min: 1000, max: 2000 });
    expect(map.columns['Timestamp (ms)']).toEqual({ channel: 'time', unit: 'ms' });
    expect(map.columns['Notes']).toBeUndefined();
  });

  it('requires time and motor1 to be mapped', async () => {
    const { onConfirm, user } = setup();
    await user.selectOptions(channelOf('Timestamp (ms)'), '');
    await user.click(screen.getByRole('button', { name: 'Read with this map' }));
    expect(screen.getByRole('alert').textContent).toContain('No column is mapped to time.');
    expect(onConfirm).not.toHaveBeenCalled();
  });

  it('offers to save a named team preset only to those who may', async () => {
    const { onConfirm, user } = setup({ canSavePreset: true });
    await user.click(screen.getByRole('checkbox', { name: 'Save as team preset' }));
    await user.click(screen.getByRole('button', { name: 'Read with this map' }));
    expect(screen.getByRole('alert').textContent).toContain('Give the preset a name');
    await user.type(screen.getByLabelText('Preset name'), 'Kite export');
    await user.click(screen.getByRole('button', { name: 'Read with this map' }));
    expect(onConfirm.mock.calls[0]![1]).toBe('Kite export');
    cleanup();
    setup({ canSavePreset: false });
    expect(screen.queryByRole('checkbox', { name: 'Save as team preset' })).toBeNull();
  });

  it('flags µs motor columns read as fractions before anything is read, and offers µs', async () => {
    const { onConfirm, user } = setup();
    // The proposal had no values to go on, so the motors default to 0–1 fractions.
    expect(unitOf('Out0').value).toBe('frac');
    expect(screen.getByRole('status').textContent).toMatch(
      /The values of 4 columns do not look like their units/,
    );
    expect(
      screen.getByText(/motor1 \("Out0"\) is read as a 0–1 fraction, but it reaches 1100/),
    ).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Read Out0 as a 1000–2000 µs pulse' }));
    expect(unitOf('Out0').value).toBe('us');
    expect(screen.getByRole('status').textContent).toMatch(/The values of 3 columns/);
    for (const h of ['Out1', 'Out2', 'Out3'])
      await user.click(screen.getByRole('button', { name: `Read ${h} as a 1000–2000 µs pulse` }));
    expect(screen.queryByRole('status')).toBeNull();
    await user.click(screen.getByRole('button', { name: 'Read with this map' }));
    expect(onConfirm.mock.calls[0]![0].columns.Out3).toEqual({ channel: 'motor4', unit: 'us' });
  });

  it('offers the digital command range with its raw range filled in', async () => {
    const { user } = setup({
      sampleRows: [
        ['0', '48', '1100', '1100', '1100', '0.5', '16.4', 'x'],
        ['1', '900', '1100', '1100', '1100', '0.5', '16.4', 'x'],
        ['2', '2047', '1100', '1100', '1100', '0.5', '16.4', 'x'],
      ],
    });
    await user.click(screen.getByRole('button', { name: 'Read Out0 as raw values 48–2047' }));
    expect(unitOf('Out0').value).toBe('raw');
    expect((screen.getByLabelText('Raw value at 0 % for Out0') as HTMLInputElement).value).toBe(
      '48',
    );
    expect((screen.getByLabelText('Raw value at 100 % for Out0') as HTMLInputElement).value).toBe(
      '2047',
    );
  });
});
