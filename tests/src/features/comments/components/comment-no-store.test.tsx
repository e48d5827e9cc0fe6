// @vitest-environment jsdom
import { cleanup, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { CommentsRail } from '../../../../../src/features/comments/components/comments-rail';
import { LocalStoreNote } from '../../../../../src/features/sync/components/local-store-note';
import { railProps } from '../../../helpers/rail-props';
import { jsonResponse, renderWithQuery } from '../../../helpers/render-with-query';

// Storage blocked for the site: IndexedDB is there, but opening a database is refused, as a
// browser does with site data blocked. Set before dexie is loaded, which reads it once.
vi.hoisted(() => {
  const refuse = () => {
    throw new DOMException('The operation is insecure.', 'SecurityError');
  };
  Object.defineProperty(globalThis, 'indexedDB', {
    configurable: true,
    value: { open: refuse, deleteDatabase: refuse, cmp: (a: number, b: number) => a - b },
  });
});

beforeEach(() => {
  // The thread came in while online; the comment is written after the link dropped.
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      if ((init?.method ?? 'GET') !== 'GET') throw new TypeError('Failed to fetch');
      return String(input).endsWith('/comments')
        ? jsonResponse(200, { comments: [] })
        : jsonResponse(200, { members: [] });
    }),
  );
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('comments when the browser refuses storage', () => {
  it('shows the thread, says why nothing is kept, and gives back an unsent comment', async () => {
    renderWithQuery(
      <>
        <LocalStoreNote />
        <CommentsRail {...railProps({ cursorT: 7.5 })} />
      </>,
    );
    const user = userEvent.setup();
    await screen.findByText('No comments yet.');
    expect((await screen.findByRole('status')).textContent).toContain(
      'Flights can’t be kept on this device: the browser’s settings block storage for this site',
    );

    const box = screen.getByRole('textbox', { name: 'Comment at the cursor' });
    await user.type(box, 'Props chipped on landing');
    await user.click(screen.getByRole('button', { name: 'Comment' }));

    expect((await screen.findByRole('alert')).textContent).toBe(
      'Not saved: offline, and it can’t be kept on this device: the browser’s settings block storage for this site',
    );
    // Nothing typed is lost: the text is back in the box to send once online.
    expect((box as HTMLTextAreaElement).value).toBe('Props chipped on landing');
    expect(screen.queryByText('Props chipped on landing', { selector: 'p' })).toBeNull();
  });
});
