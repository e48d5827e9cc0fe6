// @vitest-environment jsdom
import { cleanup, screen, waitFor, within } from '@testing-library/react';
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

  it('names the version it started from and, when another tuner saved first, offers reload or overwrite', async () => {
    // The server holds version 3 (another tuner saved twice) while this form shows version 1.
    let held = { ...defaultThresholds, cellWatchV: 3.6 };
    let version = 3;
    let shownVersion = 1;
    const puts: { ifMatch: string | null; body: typeof held }[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (_url: RequestInfo | URL, init?: RequestInit) => {
        const answer = (v: number, t: typeof held) =>
          jsonResponse(200, { thresholds: t, isDefault: false, updatedAt: null, version: v });
        if ((init?.method ?? 'GET') === 'GET')
          return shownVersion === 1 ? answer(1, defaultThresholds) : answer(version, held);
        const ifMatch = new Headers(init?.headers).get('If-Match');
        const body = JSON.parse(String(init?.body)) as typeof held;
        puts.push({ ifMatch, body });
        if (ifMatch !== `"${version}"`)
          return jsonResponse(412, {
            error: { code: 'version_conflict', message: 'changed', currentVersion: version },
          });
        held = body;
        version += 1;
        return answer(version, held);
      }),
    );
    const user = userEvent.setup();
    renderWithQuery(<ThresholdsEditor teamId={TEAM} canEdit />);
    const watch = await screen.findByLabelText('Motor above expectation: watch (%)');
    await user.clear(watch);
    await user.type(watch, String(defaultThresholds.motorWatchPct + 1));
    await user.click(screen.getByRole('button', { name: 'Save thresholds' }));

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Changed by someone else since you opened the thresholds');
    expect(puts[0]!.ifMatch).toBe('"1"');
    expect(held.cellWatchV).toBe(3.6);

    // Reload takes their set and their version into the form.
    shownVersion = version;
    await user.click(within(alert).getByRole('button', { name: 'Reload' }));
    await waitFor(() =>
      expect(
        (screen.getByLabelText('Lowest cell under load: watch (V)') as HTMLInputElement).value,
      ).toBe('3.6'),
    );
    await waitFor(() => expect(screen.queryByRole('alert')).toBeNull());

    // A change saved now names the version it was reloaded at, and is stored.
    const again = screen.getByLabelText('Motor above expectation: watch (%)');
    await user.clear(again);
    await user.type(again, String(defaultThresholds.motorWatchPct + 2));
    await user.click(screen.getByRole('button', { name: 'Save thresholds' }));
    await waitFor(() => expect(puts).toHaveLength(2));
    expect(puts[1]!.ifMatch).toBe('"3"');
    expect(held).toMatchObject({
      cellWatchV: 3.6,
      motorWatchPct: defaultThresholds.motorWatchPct + 2,
    });
  });

  it('overwrites on request against the version the server holds now', async () => {
    let version = 5;
    const puts: (string | null)[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (_url: RequestInfo | URL, init?: RequestInit) => {
        if ((init?.method ?? 'GET') === 'GET')
          return jsonResponse(200, {
            thresholds: defaultThresholds,
            isDefault: true,
            updatedAt: null,
            version: 2,
          });
        const ifMatch = new Headers(init?.headers).get('If-Match');
        puts.push(ifMatch);
        if (ifMatch !== `"${version}"`)
          return jsonResponse(412, {
            error: { code: 'version_conflict', message: 'changed', currentVersion: version },
          });
        version += 1;
        return jsonResponse(200, {
          thresholds: JSON.parse(String(init?.body)),
          isDefault: false,
          updatedAt: '2026-04-12T09:30:00.000Z',
          version,
        });
      }),
    );
    const user = userEvent.setup();
    renderWithQuery(<ThresholdsEditor teamId={TEAM} canEdit />);
    const watch = await screen.findByLabelText('Motor above expectation: watch (%)');
    await user.clear(watch);
    await user.type(watch, String(defaultThresholds.motorWatchPct + 1));
    await user.click(screen.getByRole('button', { name: 'Save thresholds' }));
    const alert = await screen.findByRole('alert');
    await user.click(within(alert).getByRole('button', { name: 'Overwrite' }));
    await waitFor(() => expect(puts).toEqual(['"2"', '"5"']));
    expect(version).toBe(6);
  });
});
