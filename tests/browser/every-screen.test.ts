import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { Design, Instrument, Order, Quote, User } from "../../server/models";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";

// Every page there is, as each role finds it, at the sizes its people use: a laptop 1366 × 900,
// a tablet 820 × 1180 and a phone 390 × 844. Each is photographed (.test-results/screenshots/
// screen-ROLE-PAGE-SIZE.png, checked by axe-core at the shot) and checked for what the walk
// through found wrong: a page that scrolls sideways, text on a chart or drawing too small to
// read, a menu without the design check and the flat blank.

const h = useBrowser();

const SIZES = [
  { name: "laptop", width: 1366, height: 900 },
  { name: "tablet", width: 820, height: 1180 },
  { name: "phone", width: 390, height: 844 },
] as const;

type Role = "anonymous" | "customer" | "operator" | "qa" | "admin";

/** The design advisor's example requirement: 60 dB at 60 Hz, 100 µT across a can 50 mm × 120 mm inside. */
const ADVICE_EXAMPLE = "shape=cylinder&d=50&l=120&att=60&f=60&B=100&dir=transverse&qty=10&layers=3&lu=mm&fu=uT&fq=Hz";

/** What each role can open, and what shows the page has finished arriving. */
/** The lot page of the newest lot the quality queue lists (the demo's), asked of the API as the signed-in person. */
const firstQualityLot = async (page: Page) => {
  const answer = await page.request.get(`${new URL(page.url()).origin}/api/quality/lots?stage=all`);
  const { items } = (await answer.json()) as { items: Array<{ id: string }> };
  return `/quality/lots/${items[0].id}`;
};
const listOrEmpty = (testId: string, empty: RegExp) => (p: Page) => p.getByTestId(testId).or(p.getByText(empty)).first().waitFor();

const PAGES: Record<Role, Array<{ path: string | ((page: Page) => Promise<string>); name: string; ready: (page: Page) => Promise<unknown> }>> = {
  anonymous: [
    { path: "/", name: "home", ready: (p) => p.getByRole("link", { name: /check a design/i }).waitFor() },
    { path: "/sign-in", name: "sign-in", ready: (p) => p.getByLabel(/^password/i).waitFor() },
    { path: "/register", name: "register", ready: (p) => p.getByLabel(/^organisation/i).waitFor() },
    { path: "/forgot-password", name: "forgot-password", ready: (p) => p.getByRole("button", { name: /send the reset link/i }).waitFor() },
    { path: "/reset-password/not-a-real-link", name: "reset-password-bad-link", ready: (p) => p.getByTestId("reset-link-invalid").waitFor() },
    { path: "/invitation/not-a-real-link", name: "invitation-bad-link", ready: (p) => p.getByText(/expired or has already been used/i).waitFor() },
    { path: "/design-check", name: "design-check", ready: designCheckReady },
    { path: "/flat-blank", name: "flat-blank", ready: flatBlankReady },
    { path: "/verify", name: "verify", ready: (p) => p.getByTestId("drop-zone").waitFor() },
    { path: "/no-such-page", name: "not-found", ready: (p) => p.getByRole("heading", { level: 1, name: /nothing at this address/i }).waitFor() },
  ],
  customer: [
    { path: "/", name: "home", ready: (p) => p.getByRole("heading", { level: 1, name: /welcome/i }).waitFor() },
    { path: "/design-check", name: "design-check", ready: async (p) => { await designCheckReady(p); await p.getByTestId("make-panel").getByTestId("total-price").waitFor(); } },
    { path: "/flat-blank", name: "flat-blank", ready: async (p) => { await flatBlankReady(p); await p.getByTestId("total-price").waitFor(); } },
    { path: "/account", name: "account", ready: (p) => p.getByRole("button", { name: /change password/i }).waitFor() },
    { path: `/find-a-design?${ADVICE_EXAMPLE}`, name: "find-a-design", ready: findADesignAnswered },
    { path: "/designs", name: "designs", ready: (p) => p.getByTestId("designs-table").waitFor() },
    { path: async () => `/designs/compare?ids=${(await demoDesignIds()).join(",")}`, name: "designs-compare", ready: async (p) => { await p.getByTestId("comparison-table").waitFor(); await p.getByTestId("attenuation-chart").locator(".recharts-line").nth(2).waitFor(); } },
    { path: "/quotes", name: "quotes", ready: (p) => p.getByTestId("quotes-table").waitFor() },
    { path: async () => `/quotes/${await demoQuoteId("open")}`, name: "quote-open", ready: (p) => p.getByTestId("price-table").waitFor() },
    { path: async () => `/quotes/${await demoQuoteId("expired")}`, name: "quote-expired", ready: (p) => p.getByRole("button", { name: /re-quote/i }).waitFor() },
    { path: async () => `/quotes/${await demoQuoteId("open")}/order`, name: "order-form", ready: (p) => p.getByRole("button", { name: /place the order/i }).waitFor() },
    { path: "/orders", name: "orders", ready: (p) => p.getByTestId("orders-table").waitFor() },
    { path: async () => `/orders/${await demoOrderId("awaiting_payment")}`, name: "order-to-pay", ready: (p) => p.getByRole("button", { name: /^pay /i }).waitFor() },
    { path: async () => `/orders/${await demoOrderId("refunded")}`, name: "order-refunded", ready: (p) => p.getByTestId("payments-table").waitFor() },
    { path: "/certificates", name: "certificates", ready: listOrEmpty("certificates-table", /no certificates yet/i) },
  ],
  operator: [
    { path: "/", name: "home", ready: (p) => p.getByRole("heading", { level: 1, name: /welcome/i }).waitFor() },
    { path: "/design-check", name: "design-check", ready: designCheckReady },
    { path: "/flat-blank", name: "flat-blank", ready: flatBlankReady },
    { path: "/account", name: "account", ready: (p) => p.getByRole("button", { name: /change password/i }).waitFor() },
    { path: "/floor/scan", name: "scan-station", ready: (p) => p.getByLabel(/scan a traveler/i).waitFor() },
    { path: "/floor", name: "floor-board", ready: (p) => p.getByTestId("floor-jobs").waitFor() },
    { path: "/floor/furnace", name: "furnace", ready: (p) => p.getByTestId("furnace-runs").waitFor() },
    { path: "/floor/heats", name: "heats", ready: (p) => p.getByTestId("heats-table").waitFor() },
  ],
  qa: [
    { path: "/", name: "home", ready: (p) => p.getByRole("heading", { level: 1, name: /welcome/i }).waitFor() },
    { path: "/quality/calibration", name: "calibration", ready: (p) => p.getByTestId("latest-run").waitFor() },
    { path: "/quality/control-charts", name: "control-charts", ready: (p) => p.locator("[data-group]").first().waitFor() },
    { path: "/design-check", name: "design-check", ready: designCheckReady },
    { path: "/flat-blank", name: "flat-blank", ready: flatBlankReady },
    { path: "/account", name: "account", ready: (p) => p.getByRole("button", { name: /change password/i }).waitFor() },
    { path: "/floor/scan", name: "scan-station", ready: (p) => p.getByLabel(/scan a traveler/i).waitFor() },
    { path: "/floor/heats", name: "heats", ready: (p) => p.getByTestId("heats-table").waitFor() },
    { path: "/quality/lots?stage=all", name: "quality-lots", ready: listOrEmpty("quality-lots", /no lots at this stage/i) },
    { path: firstQualityLot, name: "quality-lot", ready: (p) => p.getByTestId("sample-progress").or(p.getByText(/acceptance is discontinued/i)).first().waitFor() },
    { path: "/certificates", name: "certificates", ready: listOrEmpty("certificates-table", /no certificates yet/i) },
    { path: "/quality/instruments", name: "instruments", ready: (p) => p.getByTestId("instruments").waitFor() },
    { path: async () => `/quality/instruments/${(await Instrument.findOne({ where: { name: "Helmholtz set HX-500" } }))!.id}`, name: "instrument-helmholtz", ready: (p) => p.getByTestId("instrument-history").waitFor() },
  ],
  admin: [
    { path: "/", name: "home", ready: (p) => p.getByRole("heading", { level: 1, name: /welcome/i }).waitFor() },
    { path: "/admin/users", name: "users", ready: (p) => p.getByTestId("users-table").waitFor() },
    { path: "/admin/shop-rates", name: "shop-rates", ready: (p) => p.getByTestId("group-prices").waitFor() },
    { path: "/admin/materials", name: "materials", ready: (p) => p.getByTestId("materials-table").waitFor() },
    { path: "/floor", name: "floor-board", ready: (p) => p.getByTestId("floor-jobs").waitFor() },
    { path: "/floor/release", name: "floor-release", ready: (p) => p.getByTestId("recent-lots").waitFor() },
    { path: "/floor/furnace", name: "furnace", ready: (p) => p.getByTestId("furnace-runs").waitFor() },
    { path: "/floor/heats", name: "heats", ready: (p) => p.getByTestId("heats-table").waitFor() },
    { path: "/floor/shipping", name: "shipping", ready: (p) => p.getByRole("main").getByRole("heading", { level: 2 }).first().waitFor() },
    { path: "/floor/scan", name: "scan-station", ready: (p) => p.getByLabel(/scan a traveler/i).waitFor() },
    { path: "/find-a-design", name: "find-a-design", ready: (p) => p.getByTestId("no-search-yet").waitFor() },
    { path: "/quality/calibration", name: "calibration", ready: (p) => p.getByTestId("latest-run").waitFor() },
    { path: "/quality/control-charts", name: "control-charts", ready: (p) => p.locator("[data-group]").first().waitFor() },
    { path: "/quality/instruments", name: "instruments", ready: (p) => p.getByTestId("instruments").waitFor() },
    { path: "/orders", name: "orders", ready: (p) => p.getByTestId("orders-table").waitFor() },
    { path: async () => `/orders/${await demoOrderId("paid")}`, name: "order-paid", ready: (p) => p.getByTestId("refund-form").waitFor() },
    { path: "/quotes", name: "quotes", ready: (p) => p.getByTestId("quotes-table").waitFor() },
    { path: "/design-check", name: "design-check", ready: async (p) => { await designCheckReady(p); await p.getByTestId("make-panel").getByTestId("total-price").waitFor(); } },
    { path: "/flat-blank", name: "flat-blank", ready: async (p) => { await flatBlankReady(p); await p.getByTestId("total-price").waitFor(); } },
    { path: "/account", name: "account", ready: (p) => p.getByRole("button", { name: /change password/i }).waitFor() },
  ],
};

async function findADesignAnswered(page: Page) {
  await page.getByTestId("advice").and(page.locator('[data-current="true"]')).waitFor({ timeout: 60_000 });
  await page.getByTestId("advice-chart").locator(".recharts-scatter-symbol").first().waitFor();
  await page.getByTestId("front-table").waitFor();
}

// The demo's records of the first customer organisation, for the pages about one record.
const firstCustomer = async () => (await User.findOne({ where: { email: "customer@demo.test" } }))!.organizationId!;
async function demoDesignIds(): Promise<string[]> {
  return (await Design.findAll({ where: { organizationId: await firstCustomer() }, order: [["name", "ASC"]], limit: 3 })).map((d) => d.id);
}
async function demoQuoteId(status: "open" | "expired"): Promise<string> {
  const organizationId = await firstCustomer();
  const quotes = await Quote.findAll({ where: { organizationId }, order: [["number", "ASC"]] });
  const ordered = new Set((await Order.findAll({ where: { organizationId } })).map((o) => o.quoteId));
  const now = new Date();
  return quotes.find((q) => (status === "expired" ? q.expiresAt < now : q.expiresAt > now && !ordered.has(q.id)))!.id;
}
async function demoOrderId(status: string): Promise<string> {
  return (await Order.findOne({ where: { organizationId: await firstCustomer(), status }, order: [["number", "ASC"]] }))!.id;
}

async function designCheckReady(page: Page) {
  await page.getByTestId("attenuation-db").filter({ hasText: /dB/ }).waitFor();
  await page.getByTestId("attenuation-chart").locator(".recharts-line").first().waitFor();
  await page.getByTestId("cross-section").waitFor();
  await page.getByTestId("make-panel").getByTestId("make-blank-size").first().waitFor();
  await page.getByTestId("prediction").and(page.locator(":not([aria-busy])")).waitFor();
}

async function flatBlankReady(page: Page) {
  await page.getByTestId("blank-size").waitFor();
  await page.getByRole("img", { name: /flat pattern/i }).waitFor();
}

async function signInAs(page: Page, role: Exclude<Role, "anonymous">) {
  await page.goto(`${h.baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill(`${role}@demo.test`);
  await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: /^sign in$/i }).click();
  await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
}

/** The page fits its width: nothing makes it scroll sideways. */
async function sidewaysOverflow(page: Page): Promise<number> {
  return page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
}

/** Every text in every drawing and chart, as rendered: its font size times the drawing's scale, CSS px. */
async function smallestDrawingText(page: Page): Promise<{ px: number; text: string } | null> {
  return page.evaluate(() => {
    let smallest: { px: number; text: string } | null = null;
    for (const el of Array.from(document.querySelectorAll("svg text"))) {
      const t = el as SVGTextElement;
      const box = t.getBoundingClientRect();
      if (!t.textContent?.trim() || box.width === 0) continue; // hidden or empty
      const ctm = t.getScreenCTM();
      if (!ctm) continue;
      const px = parseFloat(getComputedStyle(t).fontSize) * Math.hypot(ctm.a, ctm.b);
      if (!smallest || px < smallest.px) smallest = { px, text: t.textContent.trim() };
    }
    return smallest;
  });
}

async function walk(role: Role) {
  const { page, consoleErrors, offMachine } = await h.newPage();
  if (role !== "anonymous") await signInAs(page, role);
  for (const size of SIZES) {
    await page.setViewportSize({ width: size.width, height: size.height });
    for (const p of PAGES[role]) {
      await page.goto(`${h.baseUrl}${typeof p.path === "string" ? p.path : await p.path(page)}`);
      await p.ready(page);
      await page.waitForTimeout(250); // drawings measure their width after the first paint
      const where = `${role} ${p.name} at ${size.name}`;
      expect(await sidewaysOverflow(page), `${where} scrolls sideways`).toBeLessThanOrEqual(0);
      const small = await smallestDrawingText(page);
      if (small) expect(small.px, `${where}: "${small.text}" renders at ${small.px.toFixed(1)} px`).toBeGreaterThanOrEqual(11);
      await h.shot(page, `screen-${role}-${p.name}-${size.name}`);
    }
    // the menu: the design check and the flat blank for everyone, however the menu is shown
    const menuButton = page.getByRole("button", { name: /^menu$/i });
    if (await menuButton.isVisible()) await menuButton.click();
    const nav = page.getByRole("navigation", { name: "Main" });
    await nav.getByRole("link", { name: /^design check$/i }).waitFor();
    await nav.getByRole("link", { name: /^flat blank$/i }).waitFor();
    if (size.name === "phone") await h.shot(page, `screen-${role}-menu-phone`);
  }
  expect(consoleErrors.filter((e) => !/status of 404/.test(e)).join("\n")).toBe("");
  expect(offMachine).toEqual([]);
  await page.close();
}

describe("every screen, as each role finds it, at a laptop's, a tablet's and a phone's size", () => {
  for (const role of ["anonymous", "customer", "operator", "qa", "admin"] as const) {
    it(`as ${role === "anonymous" ? "a visitor" : `the ${role}`}`, { timeout: 600_000 }, async () => {
      await walk(role);
    });
  }

  it("staff homes link to the pages that exist: the design check, the flat blank and the account (and the planner's pages)", async () => {
    const { page } = await h.newPage();
    for (const role of ["operator", "qa", "admin"] as const) {
      await h.context.clearCookies();
      await signInAs(page, role);
      const links = page.getByTestId("home-links");
      for (const name of [/check a design/i, /size a blank/i, ...(role === "admin" ? [/edit shop rates/i, /edit materials/i, /manage users/i] : [/open your account/i])]) {
        await links.getByRole("link", { name }).waitFor();
      }
      await page.getByRole("button", { name: /sign out/i }).click();
      await page.getByRole("heading", { level: 1, name: /sign in/i }).waitFor();
    }
    await page.close();
  });
});
