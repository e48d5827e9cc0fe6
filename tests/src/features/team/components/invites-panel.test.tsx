// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Invite } from '../../../../../shared/schemas/teams';
import { InvitesPanel } from '../../../../../src/features/team/components/invites-panel';
import { jsonResponse, renderWithQuery } from '../../../helpers/render-with-query';

const TEAM = '11111111-1111-4111-8111-111111111111';
const OPEN = '22222222-2222-4222-8222-222222222222';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

const base = {
  teamId: TEAM,
  role: 'pilot' as const,
  expiresAt: '2026-05-09T09:00:00.000Z',
  createdAt: '2026-05-02T09:00:00.000Z',
  invitedBy: 'Mara',
  acceptedAt: null,
  acceptedBy: null,
  withdrawnAt: null,
  withdrawnBy: null,
};
const invites: Invite[] = [
  { ...base, id: OPEN, email: 'noor@crew.example', state: 'open' },
  {
    ...base,
    id: '33333333-3333-4333-8333-333333333333',
    email: 'cato@crew.example',
    state: 'accepted',
    acceptedAt: '2026-05-03T10:00:00.000Z',
    acceptedBy: 'Cato',
  },
  {
    ...base,
    id: '44444444-4444-4444-8444-444444444444',
    email: 'ines@crew.example',
    state: 'withdrawn',
    withdrawnAt: '2026-05-04T10:00:00.000Z',
    withdrawnBy: 'Mara',
  },
  {
    ...base,
    id: '55555555-5555-4555-8555-555555555555',
    email: 'late@crew.example',
    state: 'expired',
  },
];

function stubServer() {
  const calls: { method: string; url: string }[] = [];
  let withdrawn = false;
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: RequestInfo | URL, init?: RequestInit) => {
      const method = init?.method ?? 'GET';
      calls.push({ method, url: String(url) });
      if (method === 'DELETE') {
        withdrawn = true;
        return new Response(null, { status: 204 });
      }
      return jsonResponse(200, {
        invites: invites.map((i) =>
          i.id === OPEN && withdrawn
            ? {
                ...i,
                state: 'withdrawn',
                withdrawnAt: '2026-05-05T08:00:00.000Z',
                withdrawnBy: 'Mara',
              }
            : i,
        ),
      });
    }),
  );
  return calls;
}

const rowOf = async (email: string) =>
  (await screen.findByRole('cell', { name: email })).closest('tr') as HTMLElement;

describe('invites panel', () => {
  it('states each invitation and offers Withdraw only on the open one', async () => {
    stubServer();
    renderWithQuery(<InvitesPanel teamId={TEAM} />);
    expect(within(await rowOf('noor@crew.example')).getByText(/^open until/)).toBeTruthy();
    expect(within(await rowOf('cato@crew.example')).getByText(/^Cato joined/)).toBeTruthy();
    expect(
      within(await rowOf('ines@crew.example')).getByText(/^withdrawn .* by Mara$/),
    ).toBeTruthy();
    expect(within(await rowOf('late@crew.example')).getByText(/^expired/)).toBeTruthy();
    expect(within(await rowOf('noor@crew.example')).getByText(/by Mara/)).toBeTruthy();
    expect(screen.getAllByRole('button', { name: /^Withdraw/ })).toHaveLength(1);
  });

  it('asks before withdrawing and sends nothing when the owner says no', async () => {
    const calls = stubServer();
    const confirm = vi.spyOn(window, 'confirm').mockReturnValue(false);
    const user = userEvent.setup();
    renderWithQuery(<InvitesPanel teamId={TEAM} />);
    await user.click(
      await screen.findByRole('button', { name: 'Withdraw the invitation to noor@crew.example' }),
    );
    expect(confirm).toHaveBeenCalledWith(expect.stringContaining('noor@crew.example'));
    expect(calls.filter((c) => c.method === 'DELETE')).toEqual([]);
  });

  it('withdraws on confirmation and shows the invitation as withdrawn', async () => {
    const calls = stubServer();
    vi.spyOn(window, 'confirm').mockReturnValue(true);
    const user = userEvent.setup();
    renderWithQuery(<InvitesPanel teamId={TEAM} />);
    await user.click(
      await screen.findByRole('button', { name: 'Withdraw the invitation to noor@crew.example' }),
    );
    await waitFor(() =>
      expect(
        within(screen.getByRole('cell', { name: 'noor@crew.example' }).closest('tr')!).getByText(
          /^withdrawn/,
        ),
      ).toBeTruthy(),
    );
    expect(calls.filter((c) => c.method === 'DELETE').map((c) => c.url)).toEqual([
      `/api/teams/${TEAM}/invites/${OPEN}`,
    ]);
    expect(screen.queryAllByRole('button', { name: /^Withdraw/ })).toHaveLength(0);
  });
});
