import { NavLink, useLocation } from 'react-router-dom';
import { sections, type SectionId } from '../model/sections';

/** Links, not tabs: every section has its own address, and the cursor travels with it. */
export function SectionNav({ flightId, current }: { flightId: string; current: SectionId }) {
  const { search } = useLocation();
  return (
    <nav aria-label="Evidence" className="flex flex-wrap gap-x-1 gap-y-1 border-b border-line">
      {sections.map((s) => (
        <NavLink
          key={s.id}
          to={`/flights/${flightId}/${s.id}${search}`}
          aria-current={current === s.id ? 'page' : undefined}
          className={
            '-mb-px border-b-2 px-2 py-1.5 text-sm ' +
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
