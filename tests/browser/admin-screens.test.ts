import { randomUUID } from "node:crypto";
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { buildUser, signIn } from "../support/app";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";

// The planner's pages as the planner uses them: shop rates in money and from the library, grouped
// so the page is short; materials changed in words, with their μ(B) curves; people's roles and
// access, and invitations sent again or withdrawn.

const h = useBrowser();

async function signInAsPlanner(page: Page) {
  await page.goto(`${h.baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill("admin@demo.test");
  await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: /^sign in$/i }).click();
  await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
}

describe("shop rates, as the planner reads and edits them", () => {
  it("is short until a group is opened; rates in euros, materials from the library, one label row per table; checked before the confirmation; the outcome beside the button", async () => {
    const { page, consoleErrors } = await h.newPage();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signInAsPlanner(page);
    await page.goto(`${h.baseUrl}/admin/shop-rates`);
    await page.getByTestId("group-prices").waitFor();
    expect(await page.evaluate(() => document.documentElement.scrollHeight)).toBeLessThan(1500);

    // stock sheets: material from the library, one row of column names for the whole table
    await page.getByRole("button", { name: /^stock sheets/i }).click();
    const sheets = page.getByRole("form", { name: "Stock sheets" });
    const rows = sheets.getByTestId("edit-row");
    expect(await rows.count()).toBeGreaterThan(5);
    expect(await sheets.getByText("Gauge (mm)", { exact: true }).count()).toBe(1);
    const firstMaterial = rows.first().getByRole("combobox");
    expect(await firstMaterial.locator("option").allTextContents()).toEqual(expect.arrayContaining(["ni80 · 80 % Ni-Fe-Mo, ASTM A753 Alloy 4 (UNS N14080)"]));
    await h.shot(page, "shop-rates-sheets-open");
    await page.getByRole("button", { name: /^stock sheets/i }).click();

    // prices: typed in euros, not cents (other tests may have moved the list: read what it holds)
    const { agent } = await signIn(h.app, { email: "admin@demo.test" }, DEMO_PASSWORD);
    const list = (await agent.get("/api/shop-rates")).body.priceList as { currency: string; materials: Array<{ pricePerKg_cents: number }>; blankingPerPart_cents: number };
    expect(list.currency).toBe("EUR");
    await page.getByRole("button", { name: /prices and operation rates/i }).click();
    const prices = page.getByRole("form", { name: "Prices and operation rates" });
    const firstPrice = prices.getByLabel("Price per kg, row 1, in EUR");
    expect(await firstPrice.inputValue()).toBe((list.materials[0].pricePerKg_cents / 100).toFixed(2));
    const blanking = prices.getByLabel(/^blanking, per blank/i);
    const blankingWas = (list.blankingPerPart_cents / 100).toFixed(2);
    expect(await blanking.inputValue()).toBe(blankingWas);
    // a wrong value is named before any confirmation
    await blanking.fill("-1");
    await prices.getByRole("button", { name: /save prices/i }).click();
    await prices.getByText("Blanking rate per blank must not be negative.").waitFor();
    expect(await prices.getByRole("button", { name: /save as version/i }).count()).toBe(0);
    const changed = (list.blankingPerPart_cents / 100 + 0.1).toFixed(2);
    await blanking.fill(changed);
    await prices.getByRole("button", { name: /save prices/i }).click();
    const before = Number(await page.getByTestId("current-version").textContent());
    await prices.getByRole("button", { name: new RegExp(`save as version ${before + 1}`, "i") }).click();
    const saved = prices.getByText(new RegExp(`saved as version ${before + 1}`, "i"));
    await saved.waitFor();
    // where the person is looking: right under the button they pressed, in view
    const savedBox = (await saved.boundingBox())!;
    const buttonBox = (await prices.getByRole("button", { name: /save prices/i }).boundingBox())!;
    expect(savedBox.y - (buttonBox.y + buttonBox.height)).toBeGreaterThanOrEqual(0);
    expect(savedBox.y - (buttonBox.y + buttonBox.height)).toBeLessThan(80);
    expect(savedBox.y + savedBox.height).toBeLessThanOrEqual(900);
    expect(await blanking.inputValue()).toBe(changed);
    expect((await agent.get("/api/shop-rates")).body.priceList.blankingPerPart_cents).toBe(list.blankingPerPart_cents + 10);
    await h.shot(page, "shop-rates-prices-saved");
    // put back
    await blanking.fill(blankingWas);
    await prices.getByRole("button", { name: /save prices/i }).click();
    await prices.getByRole("button", { name: new RegExp(`save as version ${before + 2}`, "i") }).click();
    await prices.getByText(new RegExp(`saved as version ${before + 2}`, "i")).waitFor();
    expect(consoleErrors.join("\n")).toBe("");
    await page.close();
  });
});

describe("materials, as the planner keeps them", () => {
  it("shows each material's μ(B) curve, brings the edit form into view with its first box focused, and words the change log", async () => {
    const { agent, csrf } = await signIn(h.app, { email: "admin@demo.test" }, DEMO_PASSWORD);
    const id = `mt-${randomUUID().slice(0, 8)}`;
    const tag = "[memory] test value";
    const body = {
      name: `Test alloy ${id}`, relativePermeability: { initial: 20_000, maximum: 80_000 }, saturation_T: 0.8, resistivity_ohm_m: 0.6e-6, density_kg_m3: 8700,
      muCurve: [{ B_T: 0.001, mu_r: 20_000 }, { B_T: 0.3, mu_r: 80_000 }, { B_T: 0.75, mu_r: 2_000 }], asFormedFactor: 0.1, source: "Invented for a test.",
      sourceTags: { relativePermeability: tag, saturation_T: tag, resistivity_ohm_m: tag, density_kg_m3: tag, muCurve: tag, asFormedFactor: tag },
    };
    expect((await agent.post("/api/materials").set("X-CSRF-Token", csrf).send({ id, ...body })).status).toBe(201);

    const { page, consoleErrors } = await h.newPage();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signInAsPlanner(page);
    await page.goto(`${h.baseUrl}/admin/materials`);
    const table = page.getByTestId("materials-table");
    await table.waitFor();
    await page.getByRole("img", { name: /μ\(B\) curve of ni80: μr 35 000 at/ }).waitFor();
    expect(await page.getByTestId("mu-thumbnail").count()).toBeGreaterThanOrEqual(5);

    await page.getByRole("button", { name: `Edit ${id}` }).click();
    const form = page.getByRole("form", { name: `Edit ${id}` });
    await form.waitFor();
    // in view, and the first box to edit has the focus
    await expect.poll(() => page.evaluate(() => (document.activeElement as HTMLInputElement | null)?.name)).toBe("name");
    await expect.poll(async () => (await form.boundingBox())!.y, { timeout: 5000 }).toBeLessThan(450);
    const focused = (await form.getByLabel(/^name$/i).boundingBox())!;
    expect(focused.y).toBeGreaterThanOrEqual(0);
    expect(focused.y + focused.height).toBeLessThanOrEqual(900);
    await form.getByRole("img", { name: new RegExp(`μ\\(B\\) curve of ${id}: μr 20 000 at 1 mT, rising to 80 000 at 300 mT, falling to 2 000 at 750 mT`) }).waitFor();

    await form.getByLabel(/^density, in/i).fill("8690");
    await form.getByRole("button", { name: /save changes/i }).click();
    await form.getByRole("button", { name: new RegExp(`^save ${id}$`, "i") }).click();
    await form.getByText(new RegExp(`${id} is saved`)).waitFor();
    const changes = page.getByRole("list", { name: "Changes" });
    await changes.getByText("Density: 8 700 → 8 690 kg/m³").waitFor();
    await h.shot(page, "materials-change-in-words");
    expect(consoleErrors.join("\n")).toBe("");
    await page.close();
  });
});

describe("users and invitations, as the planner manages them", () => {
  it("changes a role and deactivates someone, each after a confirmation, with the history; sends an invitation again and withdraws one", async () => {
    const person = await buildUser({ role: "operator", name: `Oskar Test ${randomUUID().slice(0, 4)}` });
    const { agent, csrf } = await signIn(h.app, { email: "admin@demo.test" }, DEMO_PASSWORD);
    const invited = `invitee-${randomUUID().slice(0, 8)}@example.test`;
    expect((await agent.post("/api/invitations").set("X-CSRF-Token", csrf).send({ email: invited, role: "qa" })).status).toBe(201);

    const { page, consoleErrors } = await h.newPage();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signInAsPlanner(page);
    await page.goto(`${h.baseUrl}/admin/users?q=${encodeURIComponent(person.name)}`);
    const row = page.getByTestId("user-row").filter({ hasText: person.name });
    await row.waitFor();
    await row.getByLabel(`Role of ${person.name}`).selectOption("qa");
    await row.getByRole("button", { name: /change the role/i }).click();
    await row.getByText(/now quality/i).waitFor();
    await row.getByRole("button", { name: /deactivate/i }).click();
    await row.getByText(/signed out at once/i).waitFor();
    await row.getByRole("button", { name: /^deactivate$/i }).click();
    await row.getByText("deactivated", { exact: true }).waitFor();
    await row.getByRole("button", { name: /history/i }).click();
    await row.getByRole("list", { name: "History" }).getByText(/Role changed from Shop-floor operator to Quality inspector · by Cas Lindqvist/).waitFor();
    await row.getByRole("list", { name: "History" }).getByText(/^Deactivated/).waitFor();
    await h.shot(page, "users-role-and-access");

    // the last planner cannot step down: the answer is said in words beside the control
    await page.goto(`${h.baseUrl}/admin/users?q=admin%40demo.test`);
    const me = page.getByTestId("user-row").filter({ hasText: "admin@demo.test" });
    await me.waitFor();
    expect(await me.getByRole("button", { name: /deactivate/i }).count()).toBe(0); // not oneself

    // invitations: sent again with a new link, then withdrawn
    await page.goto(`${h.baseUrl}/admin/users`);
    const invitation = page.getByTestId("invitation-row").filter({ hasText: invited });
    await invitation.waitFor();
    await invitation.getByRole("button", { name: /send again/i }).click();
    await page.getByText(new RegExp(`Sent again to ${invited.replace(/[.]/g, "\\.")} with a new link`)).waitFor();
    await invitation.getByRole("button", { name: /withdraw/i }).click();
    await invitation.getByRole("button", { name: /^withdraw$/i }).click();
    await page.getByText(new RegExp(`The invitation to ${invited.replace(/[.]/g, "\\.")} is withdrawn`)).waitFor();
    await expect.poll(() => page.getByTestId("invitation-row").filter({ hasText: invited }).count()).toBe(0);
    await h.shot(page, "users-invitation-withdrawn");
    expect(consoleErrors.join("\n")).toBe("");
    await page.close();
  });
});
