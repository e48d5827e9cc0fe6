import { useLocalStoreProblem } from '../../../lib/local-store-status';

/**
 * Said once, under the header, when this device's store refused: the app goes on online, and
 * the pilot learns why imports and offline edits cannot be kept here.
 */
export function LocalStoreNote() {
  const problem = useLocalStoreProblem();
  if (problem === null) return null;
  return (
    <div role="status" className="border-b border-line bg-paper-sunk">
      <p className="mx-auto max-w-6xl px-4 py-2 text-sm text-ink-soft">
        Flights can&rsquo;t be kept on this device: {problem}. Flights and comments on your
        team&rsquo;s server work as usual while you are online; a log read here, or a change made
        offline, cannot be kept until the browser allows storage again.
      </p>
    </div>
  );
}
