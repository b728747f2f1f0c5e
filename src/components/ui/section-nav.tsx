import { NavLink } from "react-router-dom";

export interface SectionPage {
  label: string;
  to: string;
  /** active only on this exact path (a section's first page, whose path prefixes the others) */
  end?: boolean;
}

/** The pages of one part of the app (the shop floor, quality), linked to each other under its heading. */
export function SectionNav({ label, pages }: { label: string; pages: SectionPage[] }) {
  return (
    <nav aria-label={label} className="mb-5 border-b border-nickel-200">
      <ul className="-mb-px flex flex-wrap gap-x-1">
        {pages.map((p) => (
          <li key={p.to}>
            <NavLink
              to={p.to}
              end={p.end}
              className={({ isActive }) =>
                `inline-flex min-h-touch items-center border-b-2 px-3 font-semibold ${isActive ? "border-anneal-600 text-flux-950" : "border-transparent text-flux-700 hover:border-flux-300 hover:text-flux-900"}`
              }
            >
              {p.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
