import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { useBrowser } from "../support/browser";

// The design check as its users find it: the design in the address bar, a server failure that is
// not blamed on the inputs, announcements of what changed, a phone's result summary, a tablet's
// inputs, and Fluxwright's own notices, chart key and readout.

const h = useBrowser();
const headline = (page: Page) => page.getByTestId("attenuation-db");
const layer = (page: Page, n: number) => page.getByRole("group", { name: `Layer ${n}`, exact: true });

async function settled(page: Page) {
  await page.waitForTimeout(450);
  await page.getByTestId("prediction").and(page.locator(":not([aria-busy])")).waitFor();
}
async function changedFrom(page: Page, before: string | null): Promise<string> {
  await expect.poll(async () => (await headline(page).textContent()) ?? "", { timeout: 10_000 }).not.toBe(before);
  await settled(page);
  return (await headline(page).textContent())!;
}

describe("the design lives in the address bar", () => {
  it("reload keeps it, a link shares it, back and forward step through the edits (one step per finished edit)", async () => {
    const { page, consoleErrors } = await h.newPage();
    await page.goto(`${h.baseUrl}/design-check`);
    const first = await changedFrom(page, null);
    // arriving on a bare address writes the whole design into it
    await expect.poll(() => new URL(page.url()).searchParams.get("layer")).toBe("ni80:1:10");

    // typing: one history entry for the box, however many keys
    const thickness = layer(page, 1).getByLabel(/wall thickness/i);
    await thickness.fill("1");
    await thickness.pressSequentially(".5", { delay: 60 });
    await thickness.blur();
    const thick = await changedFrom(page, first);
    expect(new URL(page.url()).searchParams.get("layer")).toBe("ni80:1.5:10");
    // a choice: its own entry
    await layer(page, 1).getByLabel(/material/i).selectOption("ni50");
    const ni50 = await changedFrom(page, thick);
    await page.getByLabel(/^lengths in/i).selectOption("in");
    await expect.poll(() => thickness.inputValue()).toBe("0.0590551");
    const url = page.url();
    expect(new URL(url).searchParams.get("lu")).toBe("in");

    // reload: the same design, in the same units
    await page.reload();
    await headline(page).filter({ hasText: ni50 }).waitFor();
    expect(await layer(page, 1).getByLabel(/material/i).inputValue()).toBe("ni50");
    expect(await layer(page, 1).getByLabel(/wall thickness/i).inputValue()).toBe("0.0590551");

    // a link: someone else opening it sees the same figures
    const other = await h.context.newPage();
    await other.goto(url);
    await other.getByTestId("attenuation-db").filter({ hasText: ni50 }).waitFor();
    await other.close();

    // back: inches → mm, then ni50 → ni80 (the thickness kept), then 1.5 → 1; forward again
    await page.goBack();
    await expect.poll(() => layer(page, 1).getByLabel(/wall thickness/i).inputValue()).toBe("1.5");
    await page.goBack();
    await expect.poll(() => layer(page, 1).getByLabel(/material/i).inputValue()).toBe("ni80");
    await headline(page).filter({ hasText: thick }).waitFor();
    await page.goBack();
    await expect.poll(() => layer(page, 1).getByLabel(/wall thickness/i).inputValue()).toBe("1");
    await headline(page).filter({ hasText: first }).waitFor();
    await page.goForward();
    await headline(page).filter({ hasText: thick }).waitFor();
    expect(await layer(page, 1).getByLabel(/wall thickness/i).inputValue()).toBe("1.5");
    await h.shot(page, "design-check-from-history");
    expect(consoleErrors.join("\n")).toBe("");
    await page.close();
  });
});

describe("when the server fails, the inputs are not blamed", () => {
  it("says the server could not work it out, keeps the last figures, offers to try again", async () => {
    const { page } = await h.newPage();
    await page.goto(`${h.baseUrl}/design-check`);
    const first = await changedFrom(page, null);
    let failing = true;
    await page.route("**/api/predictions", (route) =>
      failing ? route.fulfill({ status: 500, contentType: "application/json", body: JSON.stringify({ error: { code: "INTERNAL", message: "Something went wrong on our side; it has been logged." } }) }) : route.continue(),
    );
    await layer(page, 1).getByLabel(/wall thickness/i).fill("2");
    const trouble = page.getByTestId("server-trouble");
    await trouble.waitFor();
    await trouble.getByText(/could not work out the prediction just now/i).waitFor();
    await trouble.getByText(/your inputs are not the problem/i).waitFor();
    // nothing beside the fields, no "check the inputs", and the last figures still there
    expect(await page.getByText(/check the inputs/i).count()).toBe(0);
    expect(await layer(page, 1).getByLabel(/wall thickness/i).getAttribute("aria-invalid")).toBe("false");
    expect(await headline(page).textContent()).toBe(first);
    await h.shot(page, "design-check-server-trouble");
    failing = false;
    await page.getByRole("button", { name: /try again/i }).click();
    await changedFrom(page, first);
    expect(await trouble.count()).toBe(0);
    await page.unroute("**/api/predictions");
    await page.close();
  });
});

describe("accessibility of the results", () => {
  it("the chart has a name and a text summary; results announce only what changed; only live regions are status", async () => {
    const { page } = await h.newPage();
    await page.goto(`${h.baseUrl}/design-check`);
    const first = await changedFrom(page, null);
    const chart = page.getByRole("img", { name: /^Attenuation in dB from 1 Hz to 10 kHz against frequency/ });
    await chart.waitFor();
    expect(await chart.getAttribute("aria-describedby")).toBeTruthy();
    await page.getByTestId("chart-summary").getByText(/This design, as built: \d+ dB at 1 Hz, .*; [\d.]+ dB at the asked 60 Hz\./).waitFor();

    // one live region for the results, and it holds only what changed
    const live = page.locator('[role="status"], [role="alert"], [aria-live]');
    expect(await live.count()).toBe(1);
    expect(await live.first().getAttribute("data-testid")).toBe("result-announcement");
    expect(await page.getByTestId("prediction").locator("[aria-live]").count()).toBe(0);
    expect(await page.getByTestId("result-announcement").textContent()).toBe(""); // the first figures come with the page
    await layer(page, 1).getByLabel(/wall thickness/i).fill("1.5");
    const now = await changedFrom(page, first);
    const said = page.getByTestId("result-announcement");
    await expect.poll(() => said.textContent()).toMatch(/^Attenuation as built now [\d.]+ dB at 60 Hz \(was [\d.]+ dB at 60 Hz\)/);
    const text = (await said.textContent())!;
    expect(text).toContain(now);
    expect(text).not.toMatch(/saturat/i); // unchanged ("no wall saturates"), so not said again
    expect(text).not.toContain("Method:"); // never the whole block
    // the cautions and warnings are part of the page, not announcements
    expect(await page.getByTestId("cautions").locator('[role="status"]').count()).toBe(0);
    await page.close();
  });
});

describe("small screens", () => {
  it("a tablet gets inputs it can use; a phone keeps a compact result in view while editing", async () => {
    const { page } = await h.newPage();
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.goto(`${h.baseUrl}/design-check`);
    await changedFrom(page, null);
    for (const label of [/^shape$/i, /inside diameter/i, /^frequency/i]) {
      const box = (await page.getByLabel(label).first().boundingBox())!;
      expect(box.width, String(label)).toBeGreaterThanOrEqual(300);
    }
    // the material list is not cut: its box is as wide as the layer
    const material = (await layer(page, 1).getByLabel(/material/i).boundingBox())!;
    expect(material.width).toBeGreaterThan(600);
    await h.shot(page, "design-check-tablet-inputs");

    await page.setViewportSize({ width: 390, height: 844 });
    const thickness = layer(page, 1).getByLabel(/wall thickness/i);
    await thickness.scrollIntoViewIfNeeded();
    await thickness.fill("1.2");
    await settled(page);
    const summary = page.getByTestId("result-summary");
    const s = (await summary.boundingBox())!;
    // pinned to the foot of the screen while the form is being edited, not hiding the box being typed in
    expect(s.y + s.height).toBeLessThanOrEqual(844 + 1);
    expect(s.y).toBeGreaterThan(844 - 160);
    const t = (await thickness.boundingBox())!;
    expect(t.y + t.height).toBeLessThanOrEqual(s.y);
    await summary.getByTestId("summary-db").filter({ hasText: (await headline(page).textContent())! }).waitFor();
    await page.screenshot({ path: ".test-results/screenshots/design-check-phone-editing.png" });
    await h.axe(page, "phone editing");
    await page.close();
  });
});

describe("Fluxwright's own look", () => {
  it("notices without a coloured bar on the left or a bold word run into the text; the chart's key and readout are the page's own", async () => {
    const { page } = await h.newPage();
    await page.goto(`${h.baseUrl}/design-check`);
    await changedFrom(page, null);
    const notices = page.locator(".notice");
    expect(await notices.count()).toBeGreaterThan(3);
    const looks = await notices.evaluateAll((els) =>
      els.map((el) => {
        const s = getComputedStyle(el);
        const text = el.querySelector("div > div");
        return { left: parseFloat(s.borderLeftWidth), top: parseFloat(s.borderTopWidth), leadStrong: text?.firstElementChild?.tagName === "STRONG" && (text.firstElementChild.textContent ?? "").endsWith(":") };
      }),
    );
    for (const l of looks) {
      expect(l.left).toBe(l.top);
      expect(l.leadStrong).toBe(false);
    }
    // the chart library's own key and readout are not used
    const chart = page.getByTestId("attenuation-chart");
    expect(await page.locator(".recharts-legend-wrapper, .recharts-default-legend").count()).toBe(0);
    await page.getByTestId("chart-key").getByText("This design, as built").waitFor();
    await chart.scrollIntoViewIfNeeded();
    const box = (await chart.boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.5, box.y + box.height * 0.5);
    await page.mouse.move(box.x + box.width * 0.6, box.y + box.height * 0.5, { steps: 5 });
    await chart.getByText(/^\d+(\.\d)? dB$/).first().waitFor();
    expect(await page.locator(".recharts-default-tooltip").count()).toBe(0);
    await chart.screenshot({ path: ".test-results/screenshots/design-check-chart-readout.png" });
    await page.close();
  });
});
