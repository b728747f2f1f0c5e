import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { signIn } from "../support/app";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";

const h = useBrowser();
const box = { shape: "box", method: "bent", dimensions_mm: { width: 80, depth: 60, height: 40 }, thickness_mm: 1.0, bendRadius_mm: 1.5, kFactor: 0.44 };

async function signInAs(page: Page, email: string) {
  await page.goto(`${h.baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill(email);
  await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: /^sign in$/i }).click();
  await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
}

const fill = async (page: Page, label: RegExp, value: string) => page.getByLabel(label).fill(value);

describe("flat blank, as a new visitor would", () => {
  it("enters the box example, sees the API's numbers and a drawing to scale, downloads the DXF", async () => {
    const { page, consoleErrors, offMachine } = await h.newPage();
    await page.goto(`${h.baseUrl}/`);
    await page.waitForTimeout(3000);
    await h.shot(page, "home-anonymous");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: /^flat blank$/i }).click();
    await page.getByRole("heading", { level: 1, name: /flat blank/i }).waitFor();
    await page.getByLabel(/shape and method/i).selectOption("box-bent");
    await fill(page, /^width/i, "80");
    await fill(page, /^depth/i, "60");
    await fill(page, /^height/i, "40");
    await fill(page, /sheet thickness/i, "1");
    await fill(page, /inside bend radius/i, "1.5");
    await fill(page, /^k-factor/i, "0.44");

    const api = await (await page.request.post(`${h.baseUrl}/api/blanks`, { data: { ...box, material: "ni80" } })).json();
    const expected = `${+api.blank.length_mm.toFixed(2)} × ${+api.blank.width_mm.toFixed(2)} mm`;
    expect(expected).toBe("160.09 × 140.09 mm".replace("160.09", String(+(160.0946897).toFixed(2))).replace("140.09", String(+(140.0946897).toFixed(2))));
    await page.getByTestId("blank-size").filter({ hasText: expected }).waitFor();
    await page.getByTestId("bend-allowance").filter({ hasText: `${+api.bendAllowance_mm.toFixed(3)} mm` }).waitFor();

    // the drawing is to scale: the outline's width in the SVG's millimetre units is the blank length
    const svg = page.getByRole("img", { name: /cross-shaped blank 160\.09 by 140\.09 mm/i });
    await svg.waitFor();
    const measured = await svg.locator('polygon[data-role="outline"]').evaluate((el) => {
      const b = (el as SVGGraphicsElement).getBBox();
      return { w: b.width, h: b.height };
    });
    expect(measured.w).toBeCloseTo(api.blank.length_mm, 3); // getBBox is single precision
    expect(measured.h).toBeCloseTo(api.blank.width_mm, 3);
    const viewBox = (await svg.getAttribute("viewBox"))!.split(" ").map(Number);
    expect(viewBox[2]).toBeGreaterThan(api.blank.length_mm);
    expect(await svg.locator('[data-role="bend-line"]').count()).toBe(4);
    expect(await svg.locator('[data-role="bend-line"]').first().getAttribute("stroke-dasharray")).toBeTruthy();
    await expect(svg.getByText(`${+api.blank.length_mm.toFixed(2)} mm`).count()).resolves.toBeGreaterThan(0);
    await page.getByText(/cut-resistant gloves/i).waitFor();
    await h.shot(page, "flat-blank-box");

    const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("button", { name: /download dxf/i }).click()]);
    // the file name says the part, its material and thickness; so does the drawing's note
    expect(download.suggestedFilename()).toBe("blank-box-bent-80x60x40-ni80-1mm.dxf");
    const dxf = readFileSync((await download.path())!, "utf8");
    expect(dxf).toMatch(/DASHED/);
    expect(dxf).toContain("Material: ni80");
    expect(dxf.trimEnd().endsWith("EOF")).toBe(true);

    // a bad value: the server's message beside the field, the last drawing kept
    await fill(page, /^k-factor/i, "0.7");
    await page.getByText(/between 0 and 0\.5/i).first().waitFor();
    await expect(page.getByLabel(/^k-factor/i).getAttribute("aria-invalid")).resolves.toBe("true");
    await page.getByTestId("blank-size").waitFor();
    await h.shot(page, "flat-blank-bad-k");

    await page.getByLabel(/shape and method/i).selectOption("cylinder-drawn");
    await fill(page, /inside diameter/i, "50");
    await fill(page, /inside height/i, "60");
    await fill(page, /inside corner radius/i, "3");
    await page.getByTestId("blank-size").filter({ hasText: /Ø 120\.9/ }).waitFor();
    await page.getByRole("heading", { name: /draw stages/i }).waitFor();
    await h.shot(page, "flat-blank-drawn");

    // the 400 for K = 0.7 is the answer the page is built to show; Chromium logs it anyway
    expect(consoleErrors.filter((e) => !/status of 400/.test(e)).join("\n")).toBe("");
    expect(offMachine).toEqual([]);
    await page.close();
  });

  it("a signed-in customer sees the price build-up and the nesting on the sheet", async () => {
    const { page, consoleErrors } = await h.newPage();
    await signInAs(page, "customer@demo.test");
    await page.goto(`${h.baseUrl}/flat-blank`);
    await page.getByLabel(/shape and method/i).selectOption("box-bent");
    await fill(page, /^k-factor/i, "0.44");
    await fill(page, /quantity/i, "25");
    const table = page.getByTestId("price-table");
    await table.waitFor();
    await table.getByText(/Total for 25/).waitFor();
    await page.getByRole("img", { name: /stock sheet/i }).waitFor();
    expect(await table.getByTestId("price-line").count()).toBeGreaterThanOrEqual(10);
    await h.shot(page, "flat-blank-price");
    expect(consoleErrors.join("\n")).toBe("");
    await page.getByRole("button", { name: /sign out/i }).click();
    await page.close();
  });
});

describe("flat blank materials", () => {
  it("lists the library the server has now: a material the planner adds appears, a retired one goes", async () => {
    const { agent, csrf } = await signIn(h.app, { email: "admin@demo.test" }, DEMO_PASSWORD);
    const id = `fb-${randomUUID().slice(0, 8)}`;
    const name = `Flat-blank test alloy ${id}`;
    const tag = "[memory] test value";
    const body = {
      name, relativePermeability: { initial: 20_000, maximum: 80_000 }, saturation_T: 0.8, resistivity_ohm_m: 0.6e-6, density_kg_m3: 8700,
      muCurve: [{ B_T: 0.01, mu_r: 20_000 }, { B_T: 0.3, mu_r: 80_000 }], asFormedFactor: 0.1, source: "Invented for a test.",
      sourceTags: { relativePermeability: tag, saturation_T: tag, resistivity_ohm_m: tag, density_kg_m3: tag, muCurve: tag, asFormedFactor: tag },
    };
    expect((await agent.post("/api/materials").set("X-CSRF-Token", csrf).send({ id, ...body })).status).toBe(201);

    const { page, consoleErrors } = await h.newPage();
    await page.goto(`${h.baseUrl}/flat-blank`);
    const material = page.getByLabel(/^material/i);
    await material.locator(`option[value="${id}"]`).waitFor({ state: "attached", timeout: 10_000 });
    expect(await material.locator(`option[value="${id}"]`).textContent()).toBe(name);
    await material.selectOption(id);
    await page.getByText(`Mass in ${id}`).waitFor();
    await h.shot(page, "flat-blank-added-material");

    expect((await agent.put(`/api/materials/${id}`).set("X-CSRF-Token", csrf).send({ ...body, active: false })).status).toBe(200);
    await page.goto(`${h.baseUrl}/flat-blank`);
    await material.locator('option[value="ni80"]').waitFor({ state: "attached" });
    expect(await material.locator(`option[value="${id}"]`).count()).toBe(0);
    expect(consoleErrors).toEqual([]);
    await page.close();
  });
});

describe("shop rates, as the planner", () => {
  it("changes a rate, confirms, and sees the new version", async () => {
    const { page, consoleErrors } = await h.newPage();
    await signInAs(page, "admin@demo.test");
    await page.getByRole("link", { name: /shop rates/i }).first().click();
    await page.getByRole("heading", { level: 1, name: /shop rates/i }).waitFor();
    const before = Number(await page.getByTestId("current-version").textContent());
    await h.shot(page, "shop-rates");
    // the groups open one at a time, so the page is a list of its parts
    await page.getByRole("button", { name: /prices and operation rates/i }).click();
    const margin = page.getByLabel(/^margin/i);
    await margin.fill(String(Number(await margin.inputValue()) + 1));
    await page.getByRole("button", { name: /save prices/i }).click();
    await page.getByRole("button", { name: new RegExp(`save as version ${before + 1}`, "i") }).click();
    await page.getByText(new RegExp(`saved as version ${before + 1}`, "i")).waitFor();
    await page.getByTestId("current-version").filter({ hasText: String(before + 1) }).waitFor();
    await page.getByRole("list", { name: /versions/i }).getByText(/Cas Lindqvist/).first().waitFor();
    await h.shot(page, "shop-rates-saved");

    // the construction limits the predictions assume: a bad value named before any confirmation, then a change saved and put back
    await page.getByRole("button", { name: /construction limits \(predictions\)/i }).click();
    const construction = page.getByRole("form", { name: "Construction limits" });
    const box = construction.getByRole("group", { name: /box with a slip-on lid/i }).getByLabel(/one layer/i);
    const was = await box.inputValue();
    await box.fill("900");
    await construction.getByRole("button", { name: /save construction limits/i }).click();
    await construction.getByText(/too large: at most 160 dB/i).first().waitFor();
    expect(await box.getAttribute("aria-invalid")).toBe("true");
    expect(await construction.getByRole("button", { name: /save as version/i }).count()).toBe(0);
    await box.fill(String(Number(was) + 1));
    await construction.getByRole("button", { name: /save construction limits/i }).click();
    await construction.getByRole("button", { name: new RegExp(`save as version ${before + 2}`, "i") }).click();
    await construction.getByText(new RegExp(`saved as version ${before + 2}\\. Predictions use it`, "i")).waitFor();
    await page.getByRole("list", { name: /versions/i }).getByText(/construction limits/i).first().waitFor();
    await h.axe(page, "shop rates");
    await construction.scrollIntoViewIfNeeded();
    await h.shot(page, "shop-rates-construction");
    await construction.getByRole("button", { name: /back to the defaults/i }).click();
    await construction.getByRole("button", { name: /save construction limits/i }).click();
    await construction.getByRole("button", { name: new RegExp(`save as version ${before + 3}`, "i") }).click();
    await construction.getByText(new RegExp(`saved as version ${before + 3}`, "i")).waitFor();
    expect(consoleErrors.join("\n")).toBe("");
    await page.close();
  });
});

describe("the flat blank as its users find it", () => {
  it("opens on the design check's part; keeps the part in the address bar; inches and back leave it as it was; warns of a part larger than stock; its key shows only this blank's lines", async () => {
    const { page, consoleErrors } = await h.newPage();
    await page.goto(`${h.baseUrl}/flat-blank`);
    // the design check's default can, layer 1: the same blank on both pages
    const size = page.getByTestId("blank-size");
    await size.filter({ hasText: /^Ø 163\.92 mm$/ }).waitFor();
    // a disc has only its edge: no bend line, no relief in the key
    const key = page.getByTestId("pattern-key");
    expect(await key.locator("li").allTextContents()).toEqual(["Blank edge (cut)"]);

    await page.getByLabel(/shape and method/i).selectOption("box-bent");
    await size.filter({ hasText: /160\.\d+ × 140\.\d+ mm/ }).waitFor();
    expect(await key.locator("li").allTextContents()).toEqual(["Blank edge (cut)", "Bend line (centre of the bend)", "Corner relief"]);
    const box = (await size.textContent())!;
    await page.getByLabel(/^lengths in/i).selectOption("in");
    await expect.poll(() => page.getByLabel(/^width/i).inputValue()).toBe("3.14961");
    await size.filter({ hasText: / in$/ }).waitFor();
    await page.getByLabel(/^lengths in/i).selectOption("mm");
    await expect.poll(() => page.getByLabel(/^width/i).inputValue()).toBe("80");
    await size.filter({ hasText: box }).waitFor();
    // reload: the same part
    await page.reload();
    await size.filter({ hasText: box }).waitFor();
    expect(await page.getByLabel(/shape and method/i).inputValue()).toBe("box-bent");

    // a part larger than any sheet the shop keeps
    await page.getByLabel(/^width/i).fill("700");
    await page.getByLabel(/^depth/i).fill("650");
    const warning = page.getByTestId("blank-warnings").getByText(/larger than any stock sheet of ni80 1 mm the shop keeps/);
    await warning.waitFor();
    await h.shot(page, "flat-blank-larger-than-stock");
    expect(consoleErrors.join("\n")).toBe("");
    await page.close();
  });

  it("a customer's price has no margin line and no rates, in the page's own nesting picture; the planner sees the margin and the rates", async () => {
    for (const who of ["customer", "admin"] as const) {
      const { page } = await h.newPage();
      await signInAs(page, `${who}@demo.test`);
      await page.goto(`${h.baseUrl}/flat-blank`);
      const table = page.getByTestId("price-table");
      await table.waitFor();
      await page.getByTestId("total-price").waitFor();
      const text = (await page.locator("[data-price-view]").textContent())!;
      if (who === "customer") {
        expect(text).not.toMatch(/margin/i);
        expect(await table.getByRole("columnheader", { name: "Rate" }).count()).toBe(0);
      } else {
        expect(text).toMatch(/Margin \d+ %/);
        await table.getByRole("columnheader", { name: "Rate" }).waitFor();
      }
      // one minus sign: the scrap credit and the discount with U+2212
      expect(text).toContain("\u2212€");
      expect(text).not.toMatch(/-€/);
      // the nesting: offcut hatched, blanks clear with their numbers; not orange parts on a grey sheet
      const picture = page.getByTestId("nesting-picture");
      await picture.waitFor();
      expect(await picture.locator('[data-role="sheet"]').getAttribute("fill")).toMatch(/^url\(#/);
      const fills = await picture.locator('[data-role="placed-blank"] circle, [data-role="placed-blank"] rect').evaluateAll((els) => [...new Set(els.map((e) => e.getAttribute("fill")))]);
      expect(fills).toEqual(["#ffffff"]);
      await page.getByTestId("nesting-figures").getByText(/In blanks · offcut/).waitFor();
      await h.shot(page, `flat-blank-price-${who}`);
      await page.close();
    }
  });
});
