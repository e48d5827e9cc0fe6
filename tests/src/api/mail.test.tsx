// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { mailKeys, useDevMailAvailable } from '../../../src/api/mail';
import { jsonResponse } from '../helpers/render-with-query';

afterEach(() => vi.unstubAllGlobals());

/** A server whose health answer is `health` and whose inbox exists when `inbox` says so. */
function stubServer(health: object, inbox: boolean) {
  const asked: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const url = String(input);
      asked.push(url);
      if (url === '/api/health') return jsonResponse(200, health);
      if (url === '/api/dev/mail')
        return inbox
          ? jsonResponse(200, { messages: [] })
          : jsonResponse(404, { error: { code: 'not_found', message: 'Not found.' } });
      throw new Error(`unexpected request ${url}`);
    }),
  );
  return asked;
}

function renderAvailable(
  client = new QueryClient({ defaultOptions: { queries: { retry: false } } }),
) {
  const wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={client}>{children}</QueryClientProvider>
  );
  return { ...renderHook(() => useDevMailAvailable(), { wrapper }), client };
}

describe('the dev inbox link', () => {
  it('never asks for the inbox when the server says it sends real mail', async () => {
    const asked = stubServer({ ok: true, db: 'ok', devMail: false }, false);
    const { result } = renderAvailable();
    await waitFor(() => expect(asked).toContain('/api/health'));
    // Give a probe every chance to go out before checking that none did.
    await new Promise((r) => setTimeout(r, 50));
    expect(result.current).toBe(false);
    expect(asked).not.toContain('/api/dev/mail');
  });

  it('shows the link at once when the server says its inbox is on', async () => {
    const asked = stubServer({ ok: true, db: 'ok', devMail: true }, true);
    const { result } = renderAvailable();
    await waitFor(() => expect(result.current).toBe(true));
    expect(asked).not.toContain('/api/dev/mail');
  });

  it('remembers what the health answer said, so the link stays after a reload with no network', async () => {
    stubServer({ ok: true, db: 'ok', devMail: true }, true);
    const { client } = renderAvailable();
    // The kept answer is what query-persistence.ts saves and restores.
    await waitFor(() => expect(client.getQueryData(mailKeys.available())).toBe(true));
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => {
        throw new TypeError('Failed to fetch');
      }),
    );
    const offline = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    offline.setQueryData(mailKeys.available(), true);
    const { result } = renderAvailable(offline);
    await waitFor(() => expect(offline.getQueryState(['status', 'health'])?.status).toBe('error'));
    expect(result.current).toBe(true);
  });

  it('asks the inbox itself when the health answer does not say', async () => {
    const asked = stubServer({ ok: true, db: 'ok' }, true);
    const { result } = renderAvailable();
    await waitFor(() => expect(result.current).toBe(true));
    expect(asked).toContain('/api/dev/mail');
  });
});
