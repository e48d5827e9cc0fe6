// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AirframeEditor } from '../../../../../src/features/aircraft/components/airframe-editor';
import { newAirframeForm } from '../../../../../src/features/aircraft/model/airframe-form';

afterEach(cleanup);

const motorsIn = (svg: HTMLElement) => svg.querySelectorAll('[data-motor]');

describe('airframe editor', () => {
  it('fills the motor table from a hex preset and draws six motors in the preview', async () => {
    const user = userEvent.setup();
    render(<AirframeEditor initial={newAirframeForm('Osprey')} onSubmit={vi.fn()} />);
    const preview = screen.getByRole('img', { name: /Top view/ });
    expect(motorsIn(preview)).toHaveLength(4);

    await user.selectOptions(screen.getByLabelText('Layout preset'), 'hex-x');
    const arm = screen.getByLabelText('Arm, centre to motor (mm)');
    await user.clear(arm);
    await user.type(arm, '300');
    await user.click(screen.getByRole('button', { name: 'Fill table from preset' }));

    const rows = within(screen.getByRole('table', { name: 'Motors' }))
      .getAllByRole('row')
      .slice(1);
    expect(rows).toHaveLength(6);
    // Motor 1 of hex X sits 30° right of the nose: x = 300·cos 30° = 259.81 (shown to 0.1 mm), y = 150.
    expect(Number((screen.getByLabelText('Motor 1 x (mm)') as HTMLInputElement).value)).toBe(259.8);
    expect(Number((screen.getByLabelText('Motor 1 y (mm)') as HTMLInputElement).value)).toBeCloseTo(
      150,
      6,
    );
    expect((screen.getByLabelText('Motor 2 spin') as HTMLSelectElement).value).toBe('cw');
    expect(motorsIn(screen.getByRole('img', { name: /Top view/ }))).toHaveLength(6);
    // A symmetric hex shares the hover equally: 100 % / 6 ≈ 16.7 % per motor.
    expect(within(rows[0]!).getByText('16.7 %')).toBeTruthy();
  });

  it('redraws the preview when a motor is added or its spin changes', async () => {
    const user = userEvent.setup();
    render(<AirframeEditor initial={newAirframeForm('Kite')} onSubmit={vi.fn()} />);
    await user.selectOptions(screen.getByLabelText('Motor 1 spin'), 'cw');
    expect(document.querySelector('[data-motor="1"] title')?.textContent).toMatch(/, cw$/);
    await user.click(screen.getByRole('button', { name: 'Add motor' }));
    expect(motorsIn(screen.getByRole('img', { name: /Top view/ }))).toHaveLength(5);
  });

  it('submits the airframe with numbers, and refuses a table with a missing position', async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn();
    render(
      <AirframeEditor
        initial={newAirframeForm('Kite')}
        onSubmit={onSubmit}
        submitLabel="Add aircraft"
      />,
    );

    const x = screen.getByLabelText('Motor 3 x (mm)');
    await user.clear(x);
    await user.click(screen.getByRole('button', { name: 'Add aircraft' }));
    expect(onSubmit).not.toHaveBeenCalled();
    expect(x.getAttribute('aria-invalid')).toBe('true');

    await user.type(x, '-77.8');
    await user.click(screen.getByRole('button', { name: 'Add aircraft' }));
    expect(onSubmit).toHaveBeenCalledTimes(1);
    const value = onSubmit.mock.calls[0]![0];
    expect(value.name).toBe('Kite');
    expect(value.airframe.motors).toHaveLength(4);
    expect(value.airframe.motors[2]).toEqual({ x: -77.8, y: expect.any(Number), spin: 'ccw' });
    expect(typeof value.airframe.massG).toBe('number');
  });

  it('moves hover share to the motors nearer a design CG and saves the CG with the airframe', async () => {
    const user = userEvent.setup();
    const onSubmit = vi.fn();
    render(<AirframeEditor initial={newAirframeForm('Heron')} onSubmit={onSubmit} />);
    await user.type(screen.getByLabelText('Design CG x forward (mm)'), '10');
    await user.click(screen.getByRole('button', { name: 'Save airframe' }));
    expect(onSubmit).not.toHaveBeenCalled();
    expect(screen.getByText(/give both CG coordinates/)).toBeTruthy();

    await user.type(screen.getByLabelText('Design CG y right (mm)'), '0');
    // Moments about the CG (lever rule): front pair at x = 77.78 mm, rear at −77.78 mm, CG 10 mm
    // forward → front/rear = (77.78 + 10) / (77.78 − 10); each front motor carries
    // 87.78 / (2 · 155.56) = 28.2 %, each rear one 21.8 %.
    const rows = within(screen.getByRole('table', { name: 'Motors' }))
      .getAllByRole('row')
      .slice(1);
    expect(within(rows[0]!).getByText('28.2 %')).toBeTruthy();
    expect(within(rows[1]!).getByText('21.8 %')).toBeTruthy();
    expect(document.querySelector('[data-design-cg] title')?.textContent).toBe(
      'Design CG at x 10.0 mm, y 0.0 mm',
    );

    await user.click(screen.getByRole('button', { name: 'Save airframe' }));
    expect(onSubmit.mock.calls[0]![0].airframe.cg).toEqual({ x: 10, y: 0 });
  });

  it('warns when prop discs overlap', async () => {
    const user = userEvent.setup();
    render(<AirframeEditor initial={newAirframeForm('Kite')} onSubmit={vi.fn()} />);
    const diameter = screen.getByLabelText('Prop diameter (in)');
    await user.clear(diameter);
    // 5-inch quad X arms are 110 mm: neighbours sit 155.6 mm apart; 7-inch discs (177.8 mm) overlap.
    await user.type(diameter, '7');
    expect(screen.getByText(/Prop discs overlap: 1–2, 1–4, 2–3, 3–4/)).toBeTruthy();
  });

  it('shows a stored airframe to 0.1 mm, and read-only for a role that cannot edit', () => {
    // A quad X from its preset has arms at 110 · cos 45° = 77.781745… mm.
    const stored = newAirframeForm('Kite');
    expect(stored.airframe.motors[0]!.x).not.toBe(77.8);
    render(<AirframeEditor initial={stored} onSubmit={vi.fn()} readOnly />);
    const x = screen.getByLabelText('Motor 1 x (mm)') as HTMLInputElement;
    expect(x.value).toBe('77.8');
    expect(x.matches(':disabled')).toBe(true);
    expect(screen.queryByRole('button', { name: 'Save airframe' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Add motor' })).toBeNull();
    expect(screen.queryByRole('button', { name: /Move motor/ })).toBeNull();
  });
});
