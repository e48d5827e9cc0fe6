import { vi } from 'vitest';
import type { CommentsRailProps } from '../../../src/features/comments/components/comments-rail';
import { flightId, pilot } from './comment-fixture';

export const railTeamId = '0b7e6d1a-2f43-4c1e-9d7a-5a3c2b1e0f01';

/** The rail of the pilot's own team flight, cursor at 0, nothing selected, unless `over` says. */
export function railProps(over: Partial<CommentsRailProps> = {}): CommentsRailProps {
  return {
    flightId,
    teamId: railTeamId,
    me: pilot,
    role: 'pilot',
    pilotId: pilot.id,
    cursorT: 0,
    onSeek: vi.fn(),
    selectedId: null,
    onSelect: vi.fn(),
    ...over,
  };
}
