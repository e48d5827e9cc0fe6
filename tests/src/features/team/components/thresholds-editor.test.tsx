// @vitest-environment jsdom
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { defaultThresholds } from '../../../../../shared/schemas/thresholds';
import { ThresholdsEditor } from '../../../../../src/features/team/components/thresholds-editor';
import { jsonResponse, renderWithQuery } from '../../../helpers/render-with-query';

const TEAM = '11111111-1111-4111-8111-111111111111';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function stubServer() {
  const calls: { method: string; body: unknown }[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (_url: RequestInfo | URL, init?: RequestInit) => {
      const body = init?.body ? JSON.parse(String(init.body)) : undefined;
      calls.push({ method: init?.method ?? 'GET', body });
      const thresholds = body ?? defaultThresholds;
      return jsonResponse(200, {
        thresholds,
        isDefault: body === undefined,
        updatedAt: body ? '2026-04-12T09:30:00.000Z' : null,
        version: body ? 2 : 1,
      });
    }),
  );
  return calls;
}

describe('thresholds editor', () => {
  it('refuses an act limit that is not stricter than its watch limit', async () => {
    const calls = stubServer();
    const user = userEvent.setup();
    renderWithQuery(<ThresholdsEditor teamId={TEAM} canEdit />);
    const act = await screen.findByLabelText('Lowest cell under load: act (V)');
    await user.clear(act);
    // Lower voltage is worse, so the act limit must sit below the watch limit.
    await user.type(act, String(defaultThresholds.cellWatchV + 0.1));
    await user.click(screen.getByRole('button', { name: 'Save thresholds' }));
    expect(await screen.findByText('act must be below watch')).toBeTruthy();
    expect(calls.filter((c) => c.method === 'PUT')).toEqual([]);
  });

  it('saves the whole set with the changed limit', async () => {
    const calls = stubServer();
    const user = userEvent.setup();
    renderWithQuery(<ThresholdsEditor teamId={TEAM} canEdit />);
    const watch = await screen.findByLabelText('Motor above expectation: watch (%)');
    await user.clear(watch);
    const between = (defaultThresholds.motorWatchPct + defaultThresholds.motorActPct) / 2;
    await user.type(watch, String(between));
    await user.click(screen.getByRole('button', { name: 'Save thresholds' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'PUT')).toBe(true));
    expect(calls.find((c) => c.method === 'PUT')?.body).toEqual({
      ...defaultThresholds,
      motorWatchPct: between,
    });
  });

  it('offers one field for every limit the verdict judges against', async () => {
    stubServer();
    renderWithQuery(<ThresholdsEditor teamId={TEAM} canEdit />);
    await screen.findByLabelText('Motor above expectation: watch (%)');
    const fields = screen.getAllByRole('textbox') as HTMLInputElement[];
    expect(fields.map((f) => Number(f.value)).sort((a, b) => a - b)).toEqual(
      Object.values(defaultThresholds).sort((a, b) => a - b),
    );
    expect(
      (screen.getByLabelText('Yaw lag behind setpoint: act (ms)') as HTMLInputElement).value,
    ).toBe(String(defaultThresholds.trackingYawLagActMs));
    expect(
      (screen.getByLabelText('Mean hover output: watch (0–1)') as HTMLInputElement).value,
    ).toBe(String(defaultThresholds.hoverOutputWatch));
  });

  it('checks the order of every watch and act pair, the new ones too', async () => {
    const calls = stubServer();
    const user = userEvent.setup();
    renderWithQuery(<ThresholdsEditor teamId={TEAM} canEdit />);
    const act = await screen.findByLabelText('Yaw lag behind setpoint: act (ms)');
    await user.clear(act);
    await user.type(act, String(defaultThresholds.trackingYawLagWatchMs));
    await user.click(screen.getByRole('button', { name: 'Save thresholds' }));
    expect(await screen.findByText('act must be above watch')).toBeTruthy();
    expect(calls.filter((c) => c.method === 'PUT')).toEqual([]);
  });

  it('is read only for a role that cannot change it', async () => {
    stubServer();
    renderWithQuery(<ThresholdsEditor teamId={TEAM} canEdit={false} />);
    await screen.findByLabelText('Motor above expectation: watch (%)');
    expect((screen.getByRole('group') as HTMLFieldSetElement).disabled).toBe(true);
    expect(screen.queryByRole('button', { name: 'Save thresholds' })).toBeNull();
  });
});
