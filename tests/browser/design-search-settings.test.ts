// The planner's design-advisor settings on the shop-rates page: a bad step named, a change saved
// as its own version, then put back.
import { describe, expect, it } from "vitest";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";

const h = useBrowser();

describe("design advisor settings, as the planner", () => {
  it("names a bad gap step, saves new steps as a version, and goes back to the defaults", async () => {
    const { page, consoleErrors } = await h.newPage();
    await page.goto(`${h.baseUrl}/sign-in`);
    await page.getByLabel(/e-?mail/i).fill("admin@demo.test");
    await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: /^sign in$/i }).click();
    await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
    await page.getByRole("link", { name: /shop rates/i }).first().click();
    await page.getByRole("heading", { level: 1, name: /shop rates/i }).waitFor();
    const before = Number(await page.getByTestId("current-version").textContent());

    const form = page.getByRole("form", { name: "Design advisor settings" });
    const gaps = form.getByLabel(/gap steps/i);
    expect(await gaps.inputValue()).toBe("5, 10, 15, 20");
    await gaps.fill("5, 10, ten");
    await form.getByRole("button", { name: /save advisor settings/i }).click();
    await form.getByRole("button", { name: new RegExp(`save as version ${before + 1}`, "i") }).click();
    await form.getByText(/a gap step must be a number/i).waitFor();
    expect(await gaps.getAttribute("aria-invalid")).toBe("true");

    await gaps.fill("6; 12 18");
    const gauges = form.getByLabel(/gauges offered/i);
    expect(await gauges.inputValue()).toBe("0.5, 1, 1.5, 2");
    await gauges.fill("1 1.5");
    await form.getByRole("button", { name: /save advisor settings/i }).click();
    await form.getByRole("button", { name: new RegExp(`save as version ${before + 1}`, "i") }).click();
    await form.getByText(new RegExp(`saved as version ${before + 1}\\. The design advisor`, "i")).waitFor();
    expect(await gaps.inputValue()).toBe("6, 12, 18");
    expect(await gauges.inputValue()).toBe("1, 1.5");
    await page.getByRole("list", { name: /versions/i }).getByText(/design advisor settings/i).first().waitFor();
    await form.scrollIntoViewIfNeeded();
    await h.shot(page, "shop-rates-design-advisor");

    await form.getByRole("button", { name: /back to the defaults/i }).click();
    await form.getByRole("button", { name: /save advisor settings/i }).click();
    await form.getByRole("button", { name: new RegExp(`save as version ${before + 2}`, "i") }).click();
    await form.getByText(new RegExp(`saved as version ${before + 2}`, "i")).waitFor();
    expect(await gaps.inputValue()).toBe("5, 10, 15, 20");
    expect(await gauges.inputValue()).toBe("0.5, 1, 1.5, 2");
    expect(consoleErrors.join("\n")).toBe("");
    await page.close();
  });
});
