// @vitest-environment jsdom
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createRef } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import {
  CommentComposer,
  type ComposerHandle,
} from '../../../../../src/features/comments/components/comment-composer';

afterEach(cleanup);

function setup() {
  const ref = createRef<ComposerHandle>();
  const onSubmit = vi.fn();
  render(
    <>
      <button type="button">Flight cursor</button>
      <CommentComposer
        ref={ref}
        label="Comment at the cursor"
        atS={12.5}
        members={[{ id: '11111111-1111-4111-8111-111111111111', name: 'Rosa Kite' }]}
        submitLabel="Comment"
        onSubmit={onSubmit}
      />
    </>,
  );
  const from = screen.getByRole('button', { name: 'Flight cursor' });
  const box = screen.getByRole('textbox', { name: 'Comment at the cursor' });
  return { ref, onSubmit, from, box };
}

describe('comment composer focus', () => {
  it('returns focus to where it was sent from once the comment is sent', async () => {
    const user = userEvent.setup();
    const { ref, onSubmit, from, box } = setup();
    from.focus();
    ref.current!.focus();
    expect(document.activeElement).toBe(box);
    await user.type(box, 'Props off before you touch it');
    await user.keyboard('{Control>}{Enter}{/Control}');
    expect(onSubmit).toHaveBeenCalledWith('Props off before you touch it', []);
    expect(document.activeElement).toBe(from);
  });

  it('gives focus back on Escape and keeps what was typed', async () => {
    const user = userEvent.setup();
    const { ref, from, box } = setup();
    from.focus();
    ref.current!.focus();
    await user.type(box, 'half a thought');
    await user.keyboard('{Escape}');
    expect(document.activeElement).toBe(from);
    expect(box).toHaveProperty('value', 'half a thought');
  });

  it('stays put when the person clicked into the box themselves', async () => {
    const user = userEvent.setup();
    const { onSubmit, box } = setup();
    await user.click(box);
    await user.type(box, 'Nice hover');
    await user.keyboard('{Control>}{Enter}{/Control}');
    expect(onSubmit).toHaveBeenCalled();
    expect(document.activeElement).toBe(box);
  });

  it('points the box at the highlighted member while suggestions are open', async () => {
    const user = userEvent.setup();
    const { box } = setup();
    await user.type(box, 'ask @Ro');
    expect(box.getAttribute('aria-controls')).toBe('mention-list');
    const active = document.getElementById(box.getAttribute('aria-activedescendant')!);
    expect(active?.textContent).toBe('Rosa Kite');
    expect(active?.getAttribute('aria-selected')).toBe('true');
  });
});
