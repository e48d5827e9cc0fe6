// @vitest-environment jsdom
// No fake IndexedDB here: the page runs where the browser offers none (a private window, or
// site data blocked), as dexie sees it.
import { cleanup, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { LocalStoreNote } from '../../../../../src/features/sync/components/local-store-note';
import { LocalFlightsPanel } from '../../../../../src/features/sync/components/local-flights-panel';
import { SyncIndicator } from '../../../../../src/features/sync/components/sync-indicator';
import { resetLocalStoreProblem } from '../../../../../src/lib/local-store-status';
import { renderWithQuery } from '../../../helpers/render-with-query';

beforeEach(() => {
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => {
      throw new TypeError('Failed to fetch');
    }),
  );
});

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  resetLocalStoreProblem();
});

describe('a browser without IndexedDB', () => {
  it('keeps the page up and says calmly that flights cannot be kept here', async () => {
    expect(globalThis.indexedDB).toBeUndefined();
    renderWithQuery(
      <>
        <LocalStoreNote />
        <SyncIndicator />
        <LocalFlightsPanel teamId="0b7e6d1a-2f43-4c1e-9d7a-5a3c2b1e0f01" aircraft={[]} canUpload />
      </>,
    );
    const note = await screen.findByRole('status');
    expect(note.textContent).toContain(
      'Flights can’t be kept on this device: this browser offers no storage to the site',
    );
    expect(screen.getByText('Nothing is kept on this device.')).toBeTruthy();
    // Not the claim that everything read here has reached the server.
    expect(screen.queryByText(/Every flight read on this device/)).toBeNull();
  });
});
