import type { User } from "../../api/auth";
import { paths } from "../../config/paths";
import { homeLabels } from "../../lib/roles";

export interface NavItem {
  label: string;
  to: string;
  /** Match only the exact path (home), not everything below it. */
  end?: boolean;
}

/** What the header offers each role. Hiding a link is convenience; the server still decides. */
export function navItemsFor(user: Pick<User, "role"> | null): NavItem[] {
  if (!user) {
    return [
      { label: "Design check", to: paths.designCheck.href() },
      { label: "Flat blank", to: paths.flatBlank.href() },
      { label: "Sign in", to: paths.signIn.href() },
      { label: "Register", to: paths.register.href() },
    ];
  }
  const home: NavItem = { label: homeLabels[user.role], to: paths.home.href(), end: true };
  const account: NavItem = { label: "Account", to: paths.account.href() };
  // the two public tools are everyone's: staff check a customer's design or a blank as often as customers do
  const tools: NavItem[] = [
    { label: "Design check", to: paths.designCheck.href() },
    { label: "Flat blank", to: paths.flatBlank.href() },
  ];
  // the design advisor: customers start there, the planner answers their questions with it
  const findADesign: NavItem = { label: "Find a design", to: paths.findADesign.href() };
  // the instrument register, calibrated predictions and control charts: the quality inspectors'
  // (one link each); the planner has one link to the quality pages, which link to each other
  const quality: NavItem[] = [
    { label: "Instruments", to: paths.instruments.href() },
    { label: "Calibration", to: paths.calibration.href() },
    { label: "Control charts", to: paths.controlCharts.href() },
  ];
  switch (user.role) {
    case "customer":
      return [home, findADesign, ...tools, { label: "Designs", to: paths.designs.href() }, { label: "Quotes", to: paths.quotes.href() }, { label: "Orders", to: paths.orders.href() }, { label: "Certificates", to: paths.certificates.href() }, account];
    case "admin":
      return [home, { label: "Orders", to: paths.orders.href() }, ...floorFor("admin"), { label: "Quality", to: paths.quality.href() }, findADesign, ...tools, { label: "Users", to: paths.adminUsers.href() }, { label: "Shop rates", to: paths.adminShopRates.href() }, { label: "Materials", to: paths.adminMaterials.href() }, account];
    case "qa":
      return [home, { label: "Lots to inspect", to: paths.qualityLots.href() }, { label: "Certificates", to: paths.certificates.href() }, ...floorFor("qa"), ...quality, ...tools, account];
    case "operator":
      return [home, ...floorFor("operator"), ...tools, account];
  }
}

/** The shop floor in the main menu; its own pages link to each other (features/floor/floor-nav.tsx). */
function floorFor(role: "admin" | "operator" | "qa"): NavItem[] {
  if (role === "admin") return [{ label: "Shop floor", to: paths.floorBoard.href() }];
  const scan: NavItem = { label: "Scan", to: paths.scanStation.href() };
  if (role === "qa") return [scan, { label: "Heats", to: paths.heats.href() }];
  return [scan, { label: "Floor board", to: paths.floorBoard.href(), end: true }];
}
