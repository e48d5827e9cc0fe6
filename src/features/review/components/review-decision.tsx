import { useState } from 'react';
import type { ReviewState } from '../../../../shared/schemas/flights';
import { useSetReview } from '../../../api/reviews';

const stateWords: Record<ReviewState, string> = {
  none: 'No review asked for',
  requested: 'Awaiting review',
  reviewed: 'Reviewed',
  'changes-requested': 'Changes asked for',
};

/** Where the flight's review stands, in the review's header. */
export function ReviewStateLine({ state }: { state: ReviewState }) {
  return (
    <p className="text-xs text-ink-soft" data-testid="review-state">
      Review: <strong className="font-medium text-ink">{stateWords[state]}</strong>
    </p>
  );
}

/**
 * Closes the review loop for a coach or the owner: mark the flight reviewed, or ask the pilot
 * for changes with an optional note. The pilot is e-mailed either way.
 */
export function ReviewDecision({ flightId, state }: { flightId: string; state: ReviewState }) {
  const decide = useSetReview(flightId);
  const [note, setNote] = useState('');
  const send = (next: 'reviewed' | 'changes-requested') =>
    decide.mutate(
      { state: next, ...(note.trim() ? { note: note.trim() } : {}) },
      { onSuccess: () => setNote('') },
    );
  return (
    <section
      aria-label="Review decision"
      className="flex flex-col gap-2 rounded border border-line bg-paper-sunk px-3 py-2"
    >
      <ReviewStateLine state={state} />
      <label className="flex flex-col gap-1 text-xs text-ink-soft">
        Note to the pilot (optional)
        <textarea
          value={note}
          onChange={(e) => setNote(e.target.value)}
          maxLength={2000}
          rows={2}
          className="rounded border border-line bg-paper-raised px-2 py-1 text-sm text-ink"
        />
      </label>
      <div className="flex flex-wrap gap-2">
        <button
          type="button"
          disabled={decide.isPending}
          onClick={() => send('reviewed')}
          className="rounded bg-slate-brand px-3 py-1 text-xs font-medium text-paper disabled:opacity-50"
        >
          Mark reviewed
        </button>
        <button
          type="button"
          disabled={decide.isPending}
          onClick={() => send('changes-requested')}
          className="rounded border border-line px-3 py-1 text-xs text-ink disabled:opacity-50"
        >
          Ask for changes
        </button>
      </div>
      {decide.isSuccess && (
        <p role="status" className="text-xs text-ok">
          Saved; the pilot gets an e-mail.
        </p>
      )}
      {decide.isError && (
        <p role="alert" className="text-xs text-sev-act">
          Not saved: {decide.error.message}
        </p>
      )}
    </section>
  );
}
