import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";

// The design advisor as a customer finds it: a requirement in, the chart, the front, the
// recommendation; the table ordered by a click; a design opened in the design check shows the
// same figures there.

const h = useBrowser();

async function signInAsCustomer(page: Page) {
  await page.goto(`${h.baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill("customer@demo.test");
  await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: /^sign in$/i }).click();
  await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
}

const money = (text: string) => Number(text.replace(/[^\d.]/g, ""));
const dbOf = (text: string | null) => Number(/([\d.]+) dB/.exec(text ?? "")![1]);
const form = (page: Page) => page.getByRole("form", { name: "Requirement" });

/** The figures of a column, top to bottom, as the front table shows them. */
async function column(page: Page, testId: "row-price" | "row-db"): Promise<number[]> {
  const texts = await page.getByTestId("front-table").getByTestId(testId).allTextContents();
  return texts.map((t) => (testId === "row-price" ? money(t) : dbOf(t)));
}

const ascending = (xs: number[]) => xs.every((x, i) => i === 0 || xs[i - 1] <= x);
const descending = (xs: number[]) => xs.every((x, i) => i === 0 || xs[i - 1] >= x);

describe("find a design", () => {
  it("from a requirement to the front, ordered by a click, to the design check with the same figures", { timeout: 240_000 }, async () => {
    const { page, consoleErrors, offMachine } = await h.newPage();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signInAsCustomer(page);
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: /^find a design$/i }).click();
    await page.getByRole("heading", { level: 1, name: /find a design/i }).waitFor();
    await page.getByTestId("no-search-yet").waitFor();
    await h.shot(page, "find-a-design-empty");

    // a problem is named beside its field, and nothing is searched
    await form(page).getByLabel(/^required attenuation/i).fill("");
    await page.getByRole("button", { name: /search designs/i }).click();
    await form(page).getByText(/required attenuation must be a number/i).waitFor();
    expect(await page.getByTestId("advice").count()).toBe(0);

    // the example: 60 dB at 60 Hz, 100 µT across a can 50 mm × 120 mm inside
    await form(page).getByLabel(/^shape/i).selectOption("cylinder");
    await form(page).getByLabel(/^inside diameter/i).fill("50");
    await form(page).getByLabel(/^inside length/i).fill("120");
    await form(page).getByLabel(/^required attenuation/i).fill("60");
    await form(page).getByLabel(/^frequency/i).fill("60");
    await form(page).getByLabel(/^field amplitude/i).fill("100");
    await form(page).getByLabel(/^field direction/i).selectOption("transverse");
    await form(page).getByLabel(/^quantity/i).fill("10");
    await page.getByRole("button", { name: /search designs/i }).click();
    await page.getByTestId("advice").and(page.locator('[data-current="true"]')).waitFor({ timeout: 60_000 });
    await page.getByTestId("advice-answer").and(page.locator(":not([aria-busy])")).waitFor();
    expect(new URL(page.url()).searchParams.get("att")).toBe("60");

    // the recommendation meets the requirement at the low end of its range, and says it is an estimate
    const recommended = page.getByTestId("recommendation");
    const band = /likely (\d+)–(\d+) dB/.exec((await recommended.getByTestId("recommended-attenuation").textContent())!)!;
    expect(Number(band[1])).toBeGreaterThanOrEqual(59.5);
    await page.getByText(/engineering estimate/i).first().waitFor();
    // the chart: every candidate drawn, the front and the recommendation among them, the figures in words beside it
    const chart = page.getByTestId("advice-chart");
    await chart.locator(".recharts-scatter-symbol").first().waitFor();
    const points = await chart.locator(".recharts-scatter-symbol").count();
    expect(points).toBeGreaterThan(3);
    await page.getByTestId("advice-chart-summary").filter({ hasText: /on the front/ }).waitFor();
    await page.getByRole("button", { name: /every design on the chart, as a table/i }).click();
    expect(await page.getByTestId("all-candidates-table").locator("tbody tr").count()).toBe(points);
    await h.shot(page, "find-a-design-answer-laptop");

    // the front table, cheapest first; a click on a header orders it the other way, another column by its figure
    const table = page.getByTestId("front-table");
    expect(await table.getAttribute("data-layout")).toBe("table");
    expect(ascending(await column(page, "row-price"))).toBe(true);
    const priceHeader = table.getByRole("columnheader", { name: /unit price/i });
    expect(await priceHeader.getAttribute("aria-sort")).toBe("ascending");
    await priceHeader.getByRole("button").click();
    expect(await priceHeader.getAttribute("aria-sort")).toBe("descending");
    const dearestFirst = await column(page, "row-price");
    expect(descending(dearestFirst)).toBe(true);
    expect(dearestFirst[0]).toBeGreaterThan(dearestFirst[dearestFirst.length - 1]);
    const dbHeader = table.getByRole("columnheader", { name: /as built/i });
    await dbHeader.getByRole("button").click();
    expect(await dbHeader.getAttribute("aria-sort")).toBe("descending");
    expect(await priceHeader.getAttribute("aria-sort")).toBe("none");
    const strongest = await column(page, "row-db");
    expect(descending(strongest)).toBe(true);

    // on a phone the rows are cards, ordered by a choice above them
    await page.setViewportSize({ width: 390, height: 844 });
    await table.and(page.locator('[data-layout="cards"]')).waitFor();
    await page.getByLabel(/^order by/i).selectOption("mass");
    await page.getByLabel(/^which first/i).selectOption("ascending");
    await h.shot(page, "find-a-design-answer-phone");
    await page.setViewportSize({ width: 1366, height: 900 });
    await table.and(page.locator('[data-layout="table"]')).waitFor();

    // the strongest design on the front, opened in the design check: its figures there are the advisor's
    await dbHeader.getByRole("button").click(); // weakest first now
    await dbHeader.getByRole("button").click(); // strongest first again
    const first = table.getByTestId("front-row").first();
    const advisedDb = dbOf(await first.getByTestId("row-db").textContent());
    const advisedPrice = money((await first.getByTestId("row-price").textContent())!);
    await first.getByTestId("open-in-design-check").click();
    await page.getByRole("heading", { level: 1, name: /design check/i }).waitFor();
    await page.getByTestId("attenuation-db").filter({ hasText: /dB/ }).waitFor();
    await page.getByTestId("prediction").and(page.locator(":not([aria-busy])")).waitFor();
    expect(dbOf(await page.getByTestId("attenuation-db").textContent())).toBeCloseTo(advisedDb, 1);
    expect(await page.getByLabel(/^inside diameter/i).inputValue()).toBe("50");
    expect(await page.getByLabel(/^inside length/i).inputValue()).toBe("120");
    // the make panel prices it at its own quantity (10 by default, as asked here)
    await page.getByTestId("make-panel").getByTestId("total-price").waitFor({ timeout: 30_000 });
    expect(money((await page.getByTestId("make-panel").getByTestId("unit-price").first().textContent())!)).toBeCloseTo(advisedPrice, 1);
    await h.shot(page, "find-a-design-opened-in-design-check");

    // Back returns to the answer, the requirement still in the form
    await page.goBack();
    await page.getByTestId("advice").and(page.locator('[data-current="true"]')).waitFor({ timeout: 60_000 });
    expect(await form(page).getByLabel(/^required attenuation/i).inputValue()).toBe("60");

    expect(consoleErrors.filter((e) => !/status of 404/.test(e)).join("\n")).toBe("");
    expect(offMachine).toEqual([]);
    await page.close();
  });

  it("a requirement nothing meets says what comes closest and what it lacks", { timeout: 120_000 }, async () => {
    const { page } = await h.newPage();
    await page.setViewportSize({ width: 820, height: 1180 });
    await signInAsCustomer(page);
    // one layer of thin sheet cannot give 200 dB
    await page.goto(`${h.baseUrl}/find-a-design?shape=cylinder&d=50&l=120&att=200&f=60&B=100&dir=transverse&qty=10&layers=1&lu=mm&fu=uT&fq=Hz`);
    await page.getByTestId("nothing-meets").waitFor({ timeout: 60_000 });
    await page.getByTestId("closest-lacks").filter({ hasText: /dB short/ }).waitFor();
    expect(await page.getByTestId("recommendation").count()).toBe(0);
    await h.shot(page, "find-a-design-nothing-meets-tablet");
    await page.close();
  });

  it("a visitor is sent to sign in first, and comes back to the page", { timeout: 60_000 }, async () => {
    const { page } = await h.newPage();
    await page.goto(`${h.baseUrl}/find-a-design`);
    await page.getByRole("heading", { level: 1, name: /sign in/i }).waitFor();
    await page.getByLabel(/e-?mail/i).fill("customer@demo.test");
    await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: /^sign in$/i }).click();
    await page.getByRole("heading", { level: 1, name: /find a design/i }).waitFor();
    await page.close();
  });
});
