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

const designCheck: Area = { title: "Design check", text: "Predicted attenuation of a shield design as built, with its likely range, saturation margins and what it takes to make.", link: { to: paths.designCheck.href(), label: "Check a design" } };
const flatBlank: Area = { title: "Flat blank", text: "The blank a can or box is cut from, its draw stages or bend allowance, the flat pattern to scale and its DXF.", link: { to: paths.flatBlank.href(), label: "Size a blank" } };
const account: Area = { title: "Your account", text: "Your name as others see it, and your password.", link: { to: paths.account.href(), label: "Open your account" } };

// What each role's home holds: the pages that exist first, with their links; then, as plain notes,
// what is coming.
const plans: Record<Role, { lead: string; areas: Area[]; comingWith: string }> = {
  customer: {
    lead: "Your shield designs, quotes, orders and certificates, in one place.",
    comingWith: "the ordering work",
    areas: [
      { ...designCheck, text: "Predicted attenuation, saturation margins and what each layer takes to make, with its price." },
      flatBlank,
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
      flatBlank,
      designCheck,
      account,
      { title: "Today's jobs", text: "Jobs released to the floor, in routing order, with their next step." },
      { title: "Scan station", text: "Scan a traveler barcode to start or complete a step at this station." },
    ],
  },
  qa: {
    lead: "Lots waiting for inspection, and the instruments that measure them.",
    comingWith: "the quality work",
    areas: [
      designCheck,
      flatBlank,
      account,
      { title: "Lots waiting for inspection", text: "Sampling plan per lot, measurements entered so far, accept or reject." },
      { title: "Instruments and calibration", text: "Which instruments are in calibration and which are due or overdue." },
    ],
  },
  admin: {
    lead: "Orders to release, furnace runs to plan, prices, materials and people.",
    comingWith: "the planning work",
    areas: [
      { title: "Shop rates", text: "Alloy prices, operation rates, margin, quantity breaks, stock sheets and forming limits.", link: { to: paths.adminShopRates.href(), label: "Edit shop rates" } },
      { title: "Materials", text: "The material library the predictions and blanks compute with, each value with its source.", link: { to: paths.adminMaterials.href(), label: "Edit materials" } },
      { title: "Users", text: "Invite customers and staff, change roles, deactivate, and see who has access.", link: { to: paths.adminUsers.href(), label: "Manage users" } },
      designCheck,
      flatBlank,
      { title: "Orders to release", text: "Paid orders waiting to be split into jobs and lots for the floor." },
      { title: "Furnace runs", text: "Hydrogen anneal runs: lots loaded, peak temperature, soak, dew point." },
    ],
  },
};

export function RoleHome({ user }: { user: User }) {
  const plan = plans[user.role];
  const open = plan.areas.filter((a) => a.link);
  const coming = plan.areas.filter((a) => !a.link);
  return (
    <>
      <PageHeader eyebrow={`${roleLabels[user.role]} · ${homeLabels[user.role]}${user.organizationName ? ` · ${user.organizationName}` : ""}`} title={`Welcome, ${user.name}`} lead={plan.lead} />
      <section aria-labelledby="home-open" className="space-y-3">
        <h2 id="home-open" className="sr-only">
          Open now
        </h2>
        <ul className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3" data-testid="home-links">
          {open.map((area) => (
            <li key={area.title} className="flex flex-col rounded-lg border border-nickel-200 bg-white p-5 shadow-sm">
              <h3 className="text-h4">{area.title}</h3>
              <p className="mt-1 flex-1 text-flux-700">{area.text}</p>
              <p className="mt-3">
                <ButtonLink to={area.link!.to}>{area.link!.label}</ButtonLink>
              </p>
            </li>
          ))}
        </ul>
      </section>
      {coming.length > 0 && (
        <section aria-labelledby="home-coming" className="mt-8 space-y-3">
          <h2 id="home-coming" className="text-h4">
            Coming with {plan.comingWith}
          </h2>
          <ul className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
            {coming.map((area) => (
              <li key={area.title} className="rounded-lg border border-dashed border-nickel-300 p-4">
                <h3 className="font-semibold text-flux-800">{area.title}</h3>
                <p className="mt-1 text-meta text-flux-700">{area.text}</p>
              </li>
            ))}
          </ul>
        </section>
      )}
    </>
  );
}
