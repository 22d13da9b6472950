import { NavLink } from 'react-router-dom';
import { SECTION_NAMES } from '../../../shared/words';

/** The draft's sections, in the order a weaver works through them; '' is Design, the workspace itself. */
export const DRAFT_SECTIONS = [
  { path: '', label: SECTION_NAMES.design },
  { path: 'plan', label: SECTION_NAMES.plan },
  { path: 'loom', label: SECTION_NAMES.loom },
  { path: 'history', label: SECTION_NAMES.history },
  { path: 'print', label: SECTION_NAMES.print },
  { path: 'notes', label: SECTION_NAMES.notes },
  { path: 'discussion', label: SECTION_NAMES.discussion },
] as const;

/** One click from any section to any other; the current one is marked by weight and a rule, not colour alone. */
export function DraftSectionBar({ draftId }: { draftId: number }) {
  return (
    <nav aria-label="Sections of this draft" className="border-b border-line">
      <ul className="flex flex-wrap gap-x-1">
        {DRAFT_SECTIONS.map((s) => (
          <li key={s.path}>
            <NavLink
              to={s.path ? `/drafts/${draftId}/${s.path}` : `/drafts/${draftId}`}
              end
              className={({ isActive }) =>
                `-mb-px block border-b-2 px-3 py-1.5 text-sm no-underline ${
                  isActive ? 'border-accent font-semibold text-accent-strong' : 'border-transparent text-ink hover:bg-sunken'
                }`
              }
            >
              {s.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
