import { useEffect, useRef } from 'react';
import { NavLink, useLocation } from 'react-router-dom';
import { sections, type SectionId } from '../model/sections';

/**
 * Links, not tabs: every section has its own address, and the cursor travels with it. One row
 * that scrolls sideways by itself on a narrow screen (the page never does), with the open
 * section brought into view.
 */
export function SectionNav({ flightId, current }: { flightId: string; current: SectionId }) {
  const { search } = useLocation();
  const nav = useRef<HTMLElement>(null);
  useEffect(() => {
    const row = nav.current;
    const link = row?.querySelector<HTMLElement>('[aria-current="page"]');
    // Sideways only: scrollIntoView would also scroll the page to a nav below the fold.
    if (!row || !link) return;
    const left = link.getBoundingClientRect().left - row.getBoundingClientRect().left;
    row.scrollLeft += left - (row.clientWidth - link.offsetWidth) / 2;
  }, [current]);
  return (
    <nav
      ref={nav}
      aria-label="Evidence"
      className="flex gap-x-1 overflow-x-auto border-b border-line [scrollbar-width:thin]"
    >
      {sections.map((s) => (
        <NavLink
          key={s.id}
          to={`/flights/${flightId}/${s.id}${search}`}
          aria-current={current === s.id ? 'page' : undefined}
          className={
            'shrink-0 whitespace-nowrap border-b-2 px-2 py-1.5 text-sm focus-visible:-outline-offset-2 ' +
            (current === s.id
              ? 'border-accent font-medium text-ink'
              : 'border-transparent text-ink-soft hover:text-ink')
          }
        >
          {s.label}
        </NavLink>
      ))}
    </nav>
  );
}
