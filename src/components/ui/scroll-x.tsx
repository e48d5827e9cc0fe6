import type { ReactNode } from 'react';

/**
 * A wide table's box: on a narrow screen it scrolls sideways by itself and the page never does.
 * It takes focus so a keyboard can scroll it too (a scrolling box with nothing focusable inside
 * is out of a keyboard's reach).
 */
export function ScrollX({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div role="region" aria-label={label} tabIndex={0} className="overflow-x-auto">
      {children}
    </div>
  );
}
