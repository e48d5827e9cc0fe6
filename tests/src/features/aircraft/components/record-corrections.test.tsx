// @vitest-environment jsdom
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { BenchRun, ServiceEntry } from '../../../../../shared/schemas/aircraft';
import { BenchRunsPanel } from '../../../../../src/features/aircraft/components/bench-runs-panel';
import { ServiceLogPanel } from '../../../../../src/features/aircraft/components/service-log-panel';
import { jsonResponse, renderWithQuery } from '../../../helpers/render-with-query';

// The thrust chart draws with canvas, which jsdom lacks; these tests are about the list.
vi.mock('../../../../../src/components/charts/xy-chart', () => ({ XyChart: () => null }));

const AIRCRAFT = '11111111-1111-4111-8111-111111111111';
const PILOT = { id: '22222222-2222-4222-8222-222222222222', name: 'Pia' };
const TUNER = { id: '33333333-3333-4333-8333-333333333333', name: 'Bo' };
const OWN = '44444444-4444-4444-8444-444444444444';
const OTHERS = '55555555-5555-4555-8555-555555555555';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

const entry = (id: string, by: typeof PILOT, note: string, canDelete: boolean): ServiceEntry => ({
  id,
  aircraftId: AIRCRAFT,
  date: '2026-05-04',
  kind: 'prop-change',
  motor: 3,
  note,
  by,
  createdAt: '2026-05-04T10:00:00.000Z',
  canDelete,
});
const run = (id: string, canDelete: boolean): BenchRun => ({
  id,
  aircraftId: AIRCRAFT,
  date: '2026-05-03',
  motor: '2207 1950 kV',
  prop: '5.1x3.6x3',
  note: '',
  rows: [
    { throttle: 0.5, thrustG: 600 },
    { throttle: 1, thrustG: 1650 },
  ],
  by: TUNER,
  createdAt: '2026-05-03T10:00:00.000Z',
  canDelete,
});

/** Answers lists from `items` and drops what a DELETE names, as the server would. */
function stubServer(key: 'entries' | 'runs', items: (ServiceEntry | BenchRun)[]) {
  const deletes: string[] = [];
  let left = items;
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: RequestInfo | URL, init?: RequestInit) => {
      if (init?.method === 'DELETE') {
        deletes.push(String(url));
        left = left.filter((i) => !String(url).endsWith(i.id));
        return new Response(null, { status: 204 });
      }
      return jsonResponse(200, { [key]: left });
    }),
  );
  return deletes;
}

describe('service log corrections', () => {
  it('shows Delete only on the entries the server says this caller may delete', async () => {
    stubServer('entries', [
      entry(OWN, PILOT, 'New prop after a gate clip', true),
      entry(OTHERS, TUNER, 'Re-soldered motor 3', false),
    ]);
    renderWithQuery(<ServiceLogPanel aircraftId={AIRCRAFT} motorCount={4} canAdd />);
    await screen.findByText('New prop after a gate clip');
    expect(screen.getAllByRole('button', { name: /^Delete/ })).toHaveLength(1);
  });

  it('deletes an entry only after confirmation', async () => {
    const deletes = stubServer('entries', [entry(OWN, PILOT, 'New prop after a gate clip', true)]);
    const confirm = vi
      .spyOn(window, 'confirm')
      .mockReturnValueOnce(false)
      .mockReturnValueOnce(true);
    const user = userEvent.setup();
    renderWithQuery(<ServiceLogPanel aircraftId={AIRCRAFT} motorCount={4} canAdd={false} />);
    const button = await screen.findByRole('button', {
      name: 'Delete the prop change entry of 2026-05-04',
    });
    await user.click(button);
    expect(confirm).toHaveBeenLastCalledWith(expect.stringContaining('New prop after a gate clip'));
    expect(deletes).toEqual([]);
    await user.click(button);
    await waitFor(() => expect(screen.getByText('No service entries yet.')).toBeTruthy());
    expect(deletes).toEqual([`/api/aircraft/${AIRCRAFT}/service-log/${OWN}`]);
  });

  it('offers nothing to delete to a role that may not', async () => {
    stubServer('entries', [entry(OTHERS, TUNER, 'Re-soldered motor 3', false)]);
    renderWithQuery(<ServiceLogPanel aircraftId={AIRCRAFT} motorCount={4} canAdd={false} />);
    await screen.findByText('Re-soldered motor 3');
    expect(screen.queryAllByRole('button', { name: /^Delete/ })).toHaveLength(0);
  });
});

describe('bench run corrections', () => {
  it('deletes a bench run after confirmation', async () => {
    const deletes = stubServer('runs', [run(OWN, true)]);
    const confirm = vi.spyOn(window, 'confirm').mockReturnValue(true);
    const user = userEvent.setup();
    renderWithQuery(<BenchRunsPanel aircraftId={AIRCRAFT} canAdd={false} />);
    await user.click(
      await screen.findByRole('button', {
        name: 'Delete the bench run of 2026-05-03 (2207 1950 kV with 5.1x3.6x3)',
      }),
    );
    expect(confirm).toHaveBeenCalledWith(expect.stringContaining('2 readings'));
    await waitFor(() => expect(screen.getByText('No bench runs yet.')).toBeTruthy());
    expect(deletes).toEqual([`/api/aircraft/${AIRCRAFT}/bench-runs/${OWN}`]);
  });

  it('hides Delete from a role that may not delete bench runs', async () => {
    stubServer('runs', [run(OWN, false)]);
    renderWithQuery(<BenchRunsPanel aircraftId={AIRCRAFT} canAdd={false} />);
    await screen.findByRole('table', { name: 'Bench run 2026-05-03 2207 1950 kV' });
    expect(screen.queryAllByRole('button', { name: /^Delete/ })).toHaveLength(0);
  });
});
