// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { presetAirframe } from '../../../shared/airframe/presets';
import type { Aircraft } from '../../../shared/schemas/aircraft';
import { useUpdateAircraft } from '../../../src/api/aircraft';
import { useAircraftAirframe } from '../../../src/features/review/model/use-aircraft-airframe';
import { sampleReport } from '../helpers/flight-fixture';
import { jsonResponse } from '../helpers/render-with-query';

const ID = '11111111-1111-4111-8111-111111111111';
const TEAM = '22222222-2222-4222-8222-222222222222';

afterEach(() => vi.unstubAllGlobals());

function kite(airframe: Aircraft['airframe'], name = 'Kite'): Aircraft {
  return {
    id: ID,
    teamId: TEAM,
    name,
    airframe,
    components: {},
    notes: '',
    flightCount: 1,
    lastFlight: null,
    awaitingReview: 0,
    version: 1,
    createdAt: '2026-11-01T10:00:00.000Z',
    updatedAt: '2026-11-01T10:00:00.000Z',
  };
}

/** One aircraft as the server keeps it: GET answers the current record, PATCH changes it. */
function stubServer(initial: Aircraft) {
  let current = initial;
  const gets: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: RequestInfo | URL, init?: RequestInit) => {
      if (init?.method === 'PATCH') {
        current = { ...current, ...(JSON.parse(String(init.body)) as Partial<Aircraft>) };
        return jsonResponse(200, current);
      }
      gets.push(String(url));
      return jsonResponse(200, current);
    }),
  );
  return gets;
}

describe('one cache entry per aircraft', () => {
  it('shows the airframe edited on the aircraft page in a review opened afterwards, with no reload', async () => {
    const before = presetAirframe('quad-x', { armMm: 110, name: '5-inch quad X' });
    const after = presetAirframe('quad-x', { armMm: 160, name: '7-inch quad X' });
    const gets = stubServer(kite(before));
    // Fresh for 30 s, as in the app's client (src/app/query-client.ts).
    const client = new QueryClient({
      defaultOptions: { queries: { retry: false, staleTime: 30_000 } },
    });
    const wrapper = ({ children }: { children: ReactNode }) => (
      <QueryClientProvider client={client}>{children}</QueryClientProvider>
    );
    const flight = { aircraftId: ID, report: sampleReport() };

    // A review of the aircraft's flight is open first.
    const review = renderHook(() => useAircraftAirframe(flight, true), { wrapper });
    await waitFor(() => expect(review.result.current.assumed).toBe(false));
    expect(review.result.current.airframe.name).toBe('5-inch quad X');
    review.unmount();

    // On the aircraft page the airframe is edited and saved.
    const page = renderHook(() => useUpdateAircraft(ID), { wrapper });
    await page.result.current.mutateAsync({ patch: { airframe: after, name: 'Kite Seven' } });
    page.unmount();

    // The review opened again shows the new airframe at once, without asking the server again.
    const reopened = renderHook(() => useAircraftAirframe(flight, true), { wrapper });
    expect(reopened.result.current.airframe).toEqual(after);
    expect(reopened.result.current.aircraftName).toBe('Kite Seven');
    expect(gets).toEqual([`/api/aircraft/${ID}`]);
  });
});
