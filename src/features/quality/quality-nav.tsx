import { NavLink } from "react-router-dom";
import { paths } from "../../config/paths";

// The quality pages link to each other here, so the planner's main menu needs one link to them all
// (the quality inspectors and the planner may open every one; the server decides).
const pages: Array<{ label: string; to: string }> = [
  { label: "Lots to inspect", to: paths.qualityLots.href() },
  { label: "Instruments", to: paths.instruments.href() },
  { label: "Calibration", to: paths.calibration.href() },
  { label: "Control charts", to: paths.controlCharts.href() },
];

export function QualityNav() {
  return (
    <nav aria-label="Quality" className="mb-5 border-b border-nickel-200">
      <ul className="-mb-px flex flex-wrap gap-x-1">
        {pages.map((p) => (
          <li key={p.to}>
            <NavLink
              to={p.to}
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
