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
  switch (user.role) {
    case "customer":
      return [home, ...tools, { label: "Certificates", to: paths.certificates.href() }, account];
    case "admin":
      return [home, { label: "Users", to: paths.adminUsers.href() }, { label: "Shop rates", to: paths.adminShopRates.href() }, { label: "Materials", to: paths.adminMaterials.href() }, ...tools, account];
    case "qa":
      return [home, { label: "Lots to inspect", to: paths.qualityLots.href() }, { label: "Certificates", to: paths.certificates.href() }, ...tools, account];
    case "operator":
      return [home, ...tools, account];
  }
}
