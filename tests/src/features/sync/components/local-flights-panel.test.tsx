// @vitest-environment jsdom
import 'fake-indexeddb/auto';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { LocalFlightsPanel } from '../../../../../src/features/sync/components/local-flights-panel';
import { SyncIndicator } from '../../../../../src/features/sync/components/sync-indicator';
import {
  closeLocalDb,
  getLocalFlight,
  localDb,
  markFlightAttemptFailed,
  saveLocalFlight,
} from '../../../../../src/lib/local-db';
import { sampleDetail, sampleFile, sampleReport } from '../../../helpers/flight-fixture';
import { renderWithQuery } from '../../../helpers/render-with-query';

const TEAM = '11111111-1111-4111-8111-111111111111';
const KITE = '33333333-3333-4333-8333-333333333333';
const A = 'aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa';
const B = 'bbbbbbbb-bbbb-4bbb-8bbb-bbbbbbbbbbbb';

beforeEach(async () => {
  await localDb().delete();
  await closeLocalDb();
});
afterEach(async () => {
  cleanup();
  await closeLocalDb();
});

const base = { file: sampleFile(), report: sampleReport(), detail: sampleDetail() };

describe('flights on this device', () => {
  it('lists what the server lacks, with the reason, and files an unknown quad under an aircraft', async () => {
    await saveLocalFlight({ ...base, id: A, fileName: 'field-1.csv' });
    await saveLocalFlight({
      ...base,
      id: B,
      fileName: 'field-2.csv',
      teamId: TEAM,
      aircraftId: KITE,
    });
    await markFlightAttemptFailed(B, '413: the log is larger than 200 MB', null);
    const user = userEvent.setup();
    renderWithQuery(
      <>
        <SyncIndicator />
        <LocalFlightsPanel teamId={TEAM} aircraft={[{ id: KITE, name: 'Kite' }]} canUpload />
      </>,
    );

    const list = await screen.findByRole('list', { name: 'Flights on this device' });
    expect(list.textContent).toContain('field-1.csv');
    expect(list.textContent).toContain('needs an aircraft');
    expect(list.textContent).toContain('refused');
    expect(list.textContent).toContain('413: the log is larger than 200 MB');
    await waitFor(() =>
      expect(screen.getByTestId('sync-state').textContent).toBe('2 flights not synced'),
    );

    await user.selectOptions(screen.getByLabelText('Aircraft for field-1.csv'), KITE);
    await waitFor(async () => expect((await getLocalFlight(A))?.aircraftId).toBe(KITE));
    expect((await getLocalFlight(A))?.teamId).toBe(TEAM);
    expect((await getLocalFlight(A))?.syncState).toBe('pending');
  });

  it('says so when everything is on the server', async () => {
    renderWithQuery(<LocalFlightsPanel teamId={TEAM} aircraft={[]} canUpload />);
    expect(
      await screen.findByText('Every flight read on this device is on the server.'),
    ).toBeTruthy();
  });
});
