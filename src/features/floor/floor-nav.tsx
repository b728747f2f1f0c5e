import { useQuery } from "@tanstack/react-query";
import { NavLink } from "react-router-dom";
import { meQueryOptions, type Role } from "../../api/auth";
import { paths } from "../../config/paths";

// The shop floor's own pages, for the roles that work in each (the server decides; this only hides links).
const pages: Array<{ label: string; to: string; end?: boolean; roles: Role[] }> = [
  { label: "Board", to: paths.floorBoard.href(), end: true, roles: ["operator", "admin"] },
  { label: "Scan station", to: paths.scanStation.href(), roles: ["operator", "qa", "admin"] },
  { label: "Release", to: paths.floorRelease.href(), roles: ["admin"] },
  { label: "Hydrogen anneal", to: paths.furnaceRuns.href(), roles: ["operator", "admin"] },
  { label: "Heats", to: paths.heats.href(), roles: ["operator", "qa", "admin"] },
  { label: "Shipping", to: paths.shipping.href(), roles: ["admin"] },
];

export function FloorNav() {
  const role = useQuery(meQueryOptions).data?.role;
  const mine = pages.filter((p) => role && p.roles.includes(role));
  if (mine.length < 2) return null;
  return (
    <nav aria-label="Shop floor" className="mb-5 border-b border-nickel-200">
      <ul className="-mb-px flex flex-wrap gap-x-1">
        {mine.map((p) => (
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
