import type { Role, User } from "../../api/auth";
import { paths } from "../../config/paths";
import { homeLabels, roleLabels } from "../../lib/roles";
import { ButtonLink } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/panel";

interface Area {
  title: string;
  text: string;
  /** where it lives, once it exists; areas without one say what work brings them */
  link?: { to: string; label: string };
}

// What each role's home holds: a link where the page exists, a plain "coming" note where it does not yet.
const plans: Record<Role, { lead: string; areas: Area[]; comingWith: string }> = {
  customer: {
    lead: "Your shield designs, quotes, orders and certificates, in one place.",
    comingWith: "the ordering work",
    areas: [
      { title: "Design check", text: "Predicted attenuation, saturation margins and what each layer takes to make, with its price.", link: { to: paths.designCheck.href(), label: "Check a design" } },
      { title: "Flat blank", text: "The blank a can or box is cut from, its flat pattern to scale and the DXF for the laser.", link: { to: paths.flatBlank.href(), label: "Size a blank" } },
      { title: "Saved designs", text: "Saved shield configurations with their predicted attenuation." },
      { title: "Quotes", text: "Prices per quantity, valid until the date shown." },
      { title: "Orders", text: "Payment status and each lot's progress through the shop." },
      { title: "Certificates", text: "Measured attenuation per lot, downloadable and verifiable." },
    ],
  },
  operator: {
    lead: "The jobs on the floor today and the scan station for travelers.",
    comingWith: "the shop-floor work",
    areas: [
      { title: "Today's jobs", text: "Jobs released to the floor, in routing order, with their next step." },
      { title: "Scan station", text: "Scan a traveler barcode to start or complete a step at this station." },
    ],
  },
  qa: {
    lead: "Lots waiting for inspection, and the instruments that measure them.",
    comingWith: "the quality work",
    areas: [
      { title: "Lots waiting for inspection", text: "Sampling plan per lot, measurements entered so far, accept or reject." },
      { title: "Instruments and calibration", text: "Which instruments are in calibration and which are due or overdue." },
    ],
  },
  admin: {
    lead: "Orders to release, furnace runs to plan, prices, materials and people.",
    comingWith: "the planning work",
    areas: [
      { title: "Orders to release", text: "Paid orders waiting to be split into jobs and lots for the floor." },
      { title: "Furnace runs", text: "Hydrogen anneal runs: lots loaded, peak temperature, soak, dew point." },
      { title: "Shop rates", text: "Alloy prices, operation rates, margin, quantity breaks, stock sheets and forming limits.", link: { to: paths.adminShopRates.href(), label: "Edit shop rates" } },
      { title: "Materials", text: "The material library the predictions and blanks compute with, each value with its source.", link: { to: paths.adminMaterials.href(), label: "Edit materials" } },
      { title: "Users", text: "Invite customers and staff, and see who has access.", link: { to: paths.adminUsers.href(), label: "Manage users" } },
    ],
  },
};

export function RoleHome({ user }: { user: User }) {
  const plan = plans[user.role];
  return (
    <>
      <PageHeader eyebrow={`${roleLabels[user.role]} · ${homeLabels[user.role]}`} title={`Welcome, ${user.name}`} lead={plan.lead} />
      <ul className="grid gap-4 sm:grid-cols-2">
        {plan.areas.map((area) => (
          <li key={area.title} className="rounded-lg border border-nickel-200 bg-white p-5 shadow-sm">
            <h2 className="text-h4">{area.title}</h2>
            <p className="mt-1 text-flux-700">{area.text}</p>
            {area.link ? (
              <p className="mt-3">
                <ButtonLink to={area.link.to}>{area.link.label}</ButtonLink>
              </p>
            ) : (
              <p className="mt-3 inline-block rounded bg-flux-50 px-2 py-0.5 font-mono text-meta text-flux-700">Coming with {plan.comingWith}</p>
            )}
          </li>
        ))}
      </ul>
    </>
  );
}
