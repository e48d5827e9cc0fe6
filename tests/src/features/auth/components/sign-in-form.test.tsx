// @vitest-environment jsdom
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SignInForm } from '../../../../../src/features/auth/components/sign-in-form';
import { jsonResponse, renderWithQuery } from '../../../helpers/render-with-query';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const me = {
  id: '0b6f3c1e-4f7a-4d2b-9a7e-3c1d2e4f5a6b',
  email: 'wren@example.org',
  name: 'Wren',
  commentMail: true,
  createdAt: '2026-03-01T10:00:00.000Z',
  teams: [],
};

describe('sign-in form', () => {
  it('shows field errors and sends nothing when the fields are empty or malformed', async () => {
    const fetchStub = vi.fn();
    vi.stubGlobal('fetch', fetchStub);
    const user = userEvent.setup();
    renderWithQuery(<SignInForm onSignedIn={vi.fn()} />);

    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('expected an e-mail address')).toBeTruthy();
    expect(screen.getByText('required')).toBeTruthy();
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');

    await user.type(screen.getByLabelText('E-mail'), 'wren@');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('expected an e-mail address')).toBeTruthy();
    expect(fetchStub).not.toHaveBeenCalled();
  });

  it("shows the server's message when the credentials are refused, and keeps what was typed", async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        jsonResponse(401, {
          error: { code: 'unauthenticated', message: 'E-mail or password is wrong.' },
        }),
      ),
    );
    const onSignedIn = vi.fn();
    const user = userEvent.setup();
    renderWithQuery(<SignInForm onSignedIn={onSignedIn} />);
    await user.type(screen.getByLabelText('E-mail'), 'wren@example.org');
    await user.type(screen.getByLabelText('Password'), 'not the password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect((await screen.findByRole('alert')).textContent).toBe('E-mail or password is wrong.');
    expect((screen.getByLabelText('E-mail') as HTMLInputElement).value).toBe('wren@example.org');
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('puts server validation issues on the field they name', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () =>
        jsonResponse(400, {
          error: {
            code: 'bad_request',
            message: 'Invalid input',
            issues: [{ path: ['email'], message: 'no such domain' }],
          },
        }),
      ),
    );
    const user = userEvent.setup();
    renderWithQuery(<SignInForm onSignedIn={vi.fn()} />);
    await user.type(screen.getByLabelText('E-mail'), 'wren@example.invalid');
    await user.type(screen.getByLabelText('Password'), 'whatever-long');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('no such domain')).toBeTruthy();
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('sends the normalised e-mail and hands the signed-in user on', async () => {
    const fetchStub = vi.fn(async (_url: RequestInfo | URL, _init?: RequestInit) =>
      jsonResponse(200, { user: me }),
    );
    vi.stubGlobal('fetch', fetchStub);
    const onSignedIn = vi.fn();
    const user = userEvent.setup();
    renderWithQuery(<SignInForm onSignedIn={onSignedIn} />);
    await user.type(screen.getByLabelText('E-mail'), '  Wren@Example.org ');
    await user.type(screen.getByLabelText('Password'), 'correct horse battery');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(onSignedIn).toHaveBeenCalledWith(me));
    const [url, init] = fetchStub.mock.calls[0]!;
    expect(url).toBe('/api/auth/sign-in');
    expect(init?.method).toBe('POST');
    expect(JSON.parse(String(init?.body))).toEqual({
      email: 'wren@example.org',
      password: 'correct horse battery',
    });
  });
});
