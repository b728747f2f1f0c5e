import { useQuery } from "@tanstack/react-query";
import { meQueryOptions, type Role } from "../../api/auth";
import { SectionNav, type SectionPage } from "../../components/ui/section-nav";
import { paths } from "../../config/paths";

// The shop floor's own pages, for the roles that work in each (the server decides; this only hides links).
const pages: Array<SectionPage & { roles: Role[] }> = [
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
  return mine.length < 2 ? null : <SectionNav label="Shop floor" pages={mine} />;
}
