// @vitest-environment jsdom
import 'fake-indexeddb/auto';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { OutboxList } from '../../../../../src/features/sync/components/outbox-list';
import {
  closeLocalDb,
  enqueue,
  listOutbox,
  localDb,
  markOutboxConflict,
} from '../../../../../src/lib/local-db';
import { renderWithQuery } from '../../../helpers/render-with-query';

const COMMENT = '44444444-4444-4444-8444-444444444444';

beforeEach(async () => {
  // The sync engine is kicked after an overwrite; with no session it does nothing.
  vi.stubGlobal(
    'fetch',
    vi.fn(async () => new Response(null, { status: 401 })),
  );
  await localDb().delete();
  await closeLocalDb();
  const entry = await enqueue({
    id: COMMENT,
    method: 'PATCH',
    path: `/api/comments/${COMMENT}`,
    body: { body: 'Typed at the field' },
    version: 1,
    label: 'Edit of your comment at 7.50 s',
  });
  await enqueue({ id: 'c2', method: 'PUT', path: '/api/comments/c2', body: {} });
  await markOutboxConflict(entry.seq!, 3, '412: changed by someone else');
});
afterEach(async () => {
  cleanup();
  vi.unstubAllGlobals();
  await closeLocalDb();
});

describe('changes waiting on this device', () => {
  it('names the edit someone else overtook and offers overwrite or keep theirs', async () => {
    renderWithQuery(<OutboxList />);
    const list = await screen.findByRole('list', { name: 'Changes on this device' });
    const row = within(list).getByText('Edit of your comment at 7.50 s').closest('li')!;
    expect(row.textContent).toContain('changed by someone else since you edited it offline');
    expect(within(list).getByText('New comment').closest('li')!.textContent).toContain('waiting');
    // Only the conflicting change asks for a choice.
    expect(within(list).getAllByRole('button', { name: 'Overwrite with mine' })).toHaveLength(1);

    await userEvent.setup().click(within(row).getByRole('button', { name: 'Overwrite with mine' }));
    await waitFor(async () =>
      expect((await listOutbox())[0]).toMatchObject({ state: 'pending', version: 3 }),
    );
  });

  it('drops the change when the pilot keeps theirs', async () => {
    renderWithQuery(<OutboxList />);
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Keep theirs' }));
    await waitFor(async () => expect((await listOutbox()).map((e) => e.id)).toEqual(['c2']));
  });
});
