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
const findADesign: Area = { title: "Find a design", text: "From the space, the field and the attenuation you need to the designs the shop can make that meet it, priced, with the one we would choose.", link: { to: paths.findADesign.href(), label: "Find a design" } };
const calibration: Area = { title: "Calibrated predictions", text: "Each kind of shield fitted to the shop's measured lots, and how much closer that brings the predictions.", link: { to: paths.calibration.href(), label: "See the calibration" } };
const controlCharts: Area = { title: "Control charts", text: "Each lot's attenuation margin per alloy and route, the run rules and the process capability.", link: { to: paths.controlCharts.href(), label: "See the charts" } };
const instruments: Area = { title: "Instruments", text: "The test instruments, their calibration certificates and due dates: which are out, overdue or due soon.", link: { to: paths.instruments.href(), label: "Open the instruments" } };
const account: Area = { title: "Your account", text: "Your name as others see it, and your password.", link: { to: paths.account.href(), label: "Open your account" } };

// What each role's home holds: the pages that exist first, with their links; then, as plain notes,
// what is coming.
const plans: Record<Role, { lead: string; areas: Area[]; comingWith: string }> = {
  customer: {
    lead: "Your shield designs, quotes, orders and certificates, in one place.",
    comingWith: "the ordering work",
    areas: [
      findADesign,
      { ...designCheck, text: "Predicted attenuation, saturation margins and what each layer takes to make, with its price." },
      flatBlank,
      { title: "Saved designs", text: "Saved shield configurations: open, compare side by side, quote.", link: { to: paths.designs.href(), label: "Your designs" } },
      { title: "Quotes", text: "Prices per quantity, valid until the date shown; the quote PDF; order from here.", link: { to: paths.quotes.href(), label: "Your quotes" } },
      { title: "Orders", text: "Payment, drawings, invoices and each order's progress through the shop.", link: { to: paths.orders.href(), label: "Your orders" } },
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
      { title: "Floor board", text: "Open work by step, late jobs, lots waiting for the furnace and holds.", link: { to: paths.floorBoard.href(), label: "Open the floor board" } },
      { title: "Scan station", text: "Scan a traveler barcode to start or complete a step at this station.", link: { to: paths.scanStation.href(), label: "Open the scan station" } },
    ],
  },
  qa: {
    lead: "Lots waiting for inspection, and the instruments that measure them.",
    comingWith: "the quality work",
    areas: [
      designCheck,
      flatBlank,
      account,
      { title: "Lots waiting for inspection", text: "Sampling plan per lot, measurements entered so far, accept or reject.", link: { to: paths.qualityLots.href(), label: "Open the lots" } },
      instruments,
      calibration,
      controlCharts,
    ],
  },
  admin: {
    lead: "Orders to release, furnace runs to plan, prices, materials and people.",
    comingWith: "the planning work",
    areas: [
      { title: "Shop rates", text: "Alloy prices, operation rates, margin, quantity breaks, stock sheets and forming limits.", link: { to: paths.adminShopRates.href(), label: "Edit shop rates" } },
      { title: "Materials", text: "The material library the predictions and blanks compute with, each value with its source.", link: { to: paths.adminMaterials.href(), label: "Edit materials" } },
      { title: "Users", text: "Invite customers and staff, change roles, deactivate, and see who has access.", link: { to: paths.adminUsers.href(), label: "Manage users" } },
      findADesign,
      instruments,
      calibration,
      controlCharts,
      designCheck,
      flatBlank,
      { title: "Orders", text: "Every customer's orders: payments, refunds, drawings; paid orders wait to be released.", link: { to: paths.orders.href({ status: "paid" }), label: "Paid orders" } },
      { title: "Orders to release", text: "Paid orders waiting to be split into jobs and lots for the floor.", link: { to: paths.floorRelease.href(), label: "Release orders" } },
      { title: "Furnace runs", text: "Hydrogen anneal runs: lots loaded, peak temperature, soak, dew point.", link: { to: paths.furnaceRuns.href(), label: "Record a furnace run" } },
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
