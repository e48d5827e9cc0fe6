// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { SelectField, TextAreaField, TextField } from '../../../../src/components/ui/field';

afterEach(cleanup);

const kinds = [
  ['text field', TextField],
  ['select field', SelectField],
  ['text area field', TextAreaField],
] as const;

describe.each(kinds)('%s', (_name, Field) => {
  it('is found by its label and described by its hint', () => {
    render(<Field label="Prop pitch" hint="inches, from the hub marking" />);
    const control = screen.getByLabelText('Prop pitch');
    expect(control.getAttribute('aria-invalid')).toBeNull();
    expect(control.getAttribute('aria-describedby')).not.toBeNull();
    const described = document.getElementById(control.getAttribute('aria-describedby')!);
    expect(described?.textContent).toBe('inches, from the hub marking');
  });

  it('marks itself invalid and shows the error instead of the hint', () => {
    render(<Field label="Prop pitch" hint="inches" error="enter a number" />);
    const control = screen.getByLabelText('Prop pitch');
    expect(control.getAttribute('aria-invalid')).toBe('true');
    const described = document.getElementById(control.getAttribute('aria-describedby')!);
    expect(described?.textContent).toBe('enter a number');
    expect(screen.queryByText('inches')).toBeNull();
  });

  it('has no description when there is neither hint nor error', () => {
    render(<Field label="Prop pitch" />);
    expect(screen.getByLabelText('Prop pitch').getAttribute('aria-describedby')).toBeNull();
  });
});
