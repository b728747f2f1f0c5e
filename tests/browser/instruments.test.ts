// The instrument register in Chromium, as the quality inspector and the planner use it: the demo's
// overdue and out-for-calibration instruments named as such, filters kept in the address, a search
// coil added (its missing area named beside the box first), an instrument of the test's own sent out
// and brought back with a certificate that then downloads byte for byte; the phone without sideways scroll.
import { createHash, randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import PDFDocument from "pdfkit";
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { utcDay } from "../../shared/quality/instruments";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";
import { buildInstrument } from "../support/quality";

const h = useBrowser();
const DAY = 86_400_000;

async function signInAs(page: Page, email: string) {
  await page.goto(`${h.baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill(email);
  await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: /^sign in$/i }).click();
  await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
}

/** A one-page calibration certificate, as a laboratory might send it. */
function certificatePdf(serial: string): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: "A4" });
    const chunks: Buffer[] = [];
    doc.on("data", (c: Buffer) => chunks.push(c));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
    doc.fontSize(16).text("Certificate of calibration (test)");
    doc.fontSize(11).text(`Instrument serial ${serial}; as found and as left within tolerance.`);
    doc.end();
  });
}

const row = (page: Page, name: string) => page.getByTestId("instrument-row").filter({ has: page.getByRole("link", { name, exact: true }) });

describe("the instrument register", () => {
  it("shows the demo's overdue and out-for-calibration instruments in words; the filters live in the address", async () => {
    const { page, consoleErrors } = await h.newPage();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signInAs(page, "qa@demo.test");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Instruments", exact: true }).click();
    await page.getByRole("heading", { level: 1, name: "Test instruments" }).waitFor();
    await page.getByTestId("instruments").waitFor();

    const overdue = row(page, "Search coil SC-50").getByTestId("due-state");
    expect(await overdue.getAttribute("data-state")).toBe("overdue");
    expect(await overdue.textContent()).toMatch(/^Overdue/);
    const out = row(page, "Fluxgate probe FX-2 (spare)");
    expect(await out.getByTestId("due-state").getAttribute("data-state")).toBe("out");
    expect(await out.textContent()).toMatch(/Out for calibration/);
    expect(await row(page, "Gaussmeter probe HP-1").getByTestId("due-state").textContent()).toMatch(/^Due in \d+ days?/);
    expect(await row(page, "Helmholtz set HX-500").textContent()).toMatch(/100 turns per coil, radius 250 mm/);
    expect(await page.getByTestId("register-summary").textContent()).toMatch(/\d+ overdue, \d+ out for calibration/);
    await h.shot(page, "instruments-register-qa-laptop");

    // kind, then usable only: both in the address, kept by a reload
    const filters = page.getByRole("group", { name: "Filter the register" });
    await filters.getByLabel("Kind").selectOption("search-coil");
    await page.waitForURL(/kind=search-coil/);
    await expect.poll(() => row(page, "Helmholtz set HX-500").count()).toBe(0);
    await row(page, "Search coil SC-50").waitFor();
    await page.getByLabel("Only those usable today").click(); // the box follows the address, which changes a moment after the click
    await page.waitForURL(/usable=true/);
    await row(page, "Search coil SC-50").waitFor({ state: "detached" });
    await row(page, "Search coil SC-200").waitFor();
    await page.reload();
    await row(page, "Search coil SC-200").waitFor();
    expect(await page.getByLabel("Only those usable today").isChecked()).toBe(true);
    expect(await filters.getByLabel("Kind").inputValue()).toBe("search-coil");
    expect(await row(page, "Search coil SC-50").count()).toBe(0);
    await h.shot(page, "instruments-register-filtered");
    expect(consoleErrors).toEqual([]);
    await page.close();
  });

  it("adds a search coil: the missing area is named beside its box, then the coil is on the register", async () => {
    const name = `Search coil T-${randomUUID().slice(0, 6)}`;
    const { page, consoleErrors } = await h.newPage();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signInAs(page, "qa@demo.test");
    await page.goto(`${h.baseUrl}/quality/instruments`);
    // by keyboard: the form opens with Enter, a refusal puts the cursor in the box named, Enter sends again
    await page.getByRole("button", { name: /add an instrument/i }).focus();
    await page.keyboard.press("Enter");
    const form = page.getByTestId("add-instrument");
    expect(await form.getByLabel("Kind").inputValue()).toBe("search-coil");
    await form.getByLabel("Name", { exact: true }).fill(name);
    await form.getByLabel("Serial number").fill("SC-T-01");
    await form.getByRole("textbox", { name: /^turns/i }).fill("150");
    await form.getByLabel("Calibration due").fill(utcDay(new Date(Date.now() + 300 * DAY)));
    await form.getByRole("button", { name: "Add to the register" }).click();

    const area = form.getByRole("textbox", { name: /area of one turn/i });
    await form.getByText("A search coil needs the area of one turn (mm²).").waitFor();
    expect(await area.getAttribute("aria-invalid")).toBe("true");
    await expect.poll(() => area.evaluate((el) => el === document.activeElement)).toBe(true);
    const described = (await area.getAttribute("aria-describedby")) ?? "";
    expect(await page.locator(`[id="${described.split(" ").pop()}"]`).textContent()).toMatch(/area of one turn/);
    await h.shot(page, "instruments-add-missing-area");

    await area.fill("201.1");
    await area.press("Enter");
    await form.getByRole("status").filter({ hasText: `${name} is on the register` }).waitFor();
    await row(page, name).waitFor();
    expect(await row(page, name).textContent()).toMatch(/150 turns, 201\.1 mm² per turn/);
    await h.shot(page, "instruments-added");
    expect(consoleErrors).toEqual([]);
    await page.close();
  });

  it("sends an instrument out after a confirmation, brings it back with a PDF certificate and a new due date; the certificate downloads", { timeout: 90_000 }, async () => {
    // an instrument of this test's own: other files measure with the demo's
    const probe = await buildInstrument({ name: `Fluxgate probe T-${randomUUID().slice(0, 6)}` });
    const pdf = await certificatePdf(probe.serialNumber!);
    const nextDue = utcDay(new Date(Date.now() + 365 * DAY));
    const { page, consoleErrors } = await h.newPage();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signInAs(page, "qa@demo.test");
    await page.goto(`${h.baseUrl}/quality/instruments`);
    await row(page, probe.name).getByRole("link", { name: probe.name }).click();
    await page.getByRole("heading", { level: 1, name: probe.name }).waitFor();
    expect(await page.getByTestId("due-state").getAttribute("data-state")).toBe("in-date");

    // out, after a confirmation
    await page.getByRole("button", { name: "Send out for calibration", exact: true }).click();
    await page.getByLabel("Laboratory").fill("Test laboratory");
    await page.getByRole("button", { name: "Send out for calibration…" }).click();
    const confirm = page.getByRole("group", { name: `Confirm sending ${probe.name} out` });
    await confirm.waitFor();
    await h.shot(page, "instrument-send-confirm");
    await confirm.getByRole("button", { name: "Send it out" }).click();
    await page.getByRole("status").filter({ hasText: "is out for calibration at Test laboratory" }).waitFor();
    await expect.poll(() => page.getByTestId("due-state").getAttribute("data-state")).toBe("out");
    await page.getByTestId("instrument-history").getByText("Sent out for calibration").waitFor();

    // back: a calibration date in the future is refused by the server, named beside its box
    const back = page.getByRole("form", { name: "Back from calibration" });
    await back.getByLabel("Calibrated on").fill(utcDay(new Date(Date.now() + 2 * DAY)));
    await back.getByLabel("Next due").fill(nextDue);
    await back.getByLabel("Certificate number").fill("TL-2291");
    await back.getByLabel("Certificate file").setInputFiles({ name: "calibration-certificate.pdf", mimeType: "application/pdf", buffer: pdf });
    await back.getByRole("button", { name: /record it as back/i }).click();
    await back.getByText("The calibration date cannot be in the future.").waitFor();
    expect(await back.getByLabel("Calibrated on").getAttribute("aria-invalid")).toBe("true");
    await h.shot(page, "instrument-return-refused");

    await back.getByLabel("Calibrated on").fill(utcDay(new Date()));
    await back.getByRole("button", { name: /record it as back/i }).click();
    await page.getByRole("status").filter({ hasText: `calibrated until ${nextDue}` }).waitFor();
    await expect.poll(() => page.getByTestId("due-state").getAttribute("data-state")).toBe("in-date");
    const record = page.getByTestId("calibration-record").filter({ hasText: "TL-2291" });
    await record.waitFor();
    expect(await record.textContent()).toContain(nextDue);
    await h.shot(page, "instrument-back-from-calibration");

    // a correction of its details, recorded in the history
    await page.getByRole("button", { name: "Correct the details" }).click();
    await page.getByLabel("Make and model").fill("single-axis fluxgate, bench unit");
    await page.getByRole("button", { name: "Save the corrections" }).click();
    await page.getByRole("status").filter({ hasText: "The corrections are saved" }).waitFor();
    await page.getByText("single-axis fluxgate, bench unit").first().waitFor();
    await page.getByTestId("instrument-history").getByText("Details changed: make and model").waitFor();

    // the certificate downloads as the very file uploaded
    const [download] = await Promise.all([page.waitForEvent("download"), record.getByRole("link", { name: /calibration-certificate\.pdf/ }).click()]);
    expect(download.suggestedFilename()).toBe("calibration-certificate.pdf");
    const saved = readFileSync((await download.path())!);
    expect(createHash("sha256").update(saved).digest("hex")).toBe(createHash("sha256").update(pdf).digest("hex"));
    expect(consoleErrors.filter((e) => !/status of 400/.test(e))).toEqual([]);
    await page.close();
  });

  it("the planner reaches it through the quality pages; on a phone neither page scrolls sideways", async () => {
    const { page } = await h.newPage();
    await page.setViewportSize({ width: 1366, height: 900 });
    await signInAs(page, "admin@demo.test");
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Quality", exact: true }).click();
    await page.getByRole("heading", { level: 1, name: "Lots to inspect" }).waitFor();
    await page.getByRole("navigation", { name: "Quality" }).getByRole("link", { name: "Instruments" }).click();
    await page.getByTestId("instruments").waitFor();
    await h.shot(page, "instruments-register-admin-laptop");

    await page.setViewportSize({ width: 390, height: 844 });
    await page.goto(`${h.baseUrl}/quality/instruments`);
    await page.getByTestId("instruments").waitFor();
    expect(await page.getByTestId("instruments").getAttribute("data-layout")).toBe("cards");
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await h.shot(page, "instruments-register-phone");

    await row(page, "Helmholtz set HX-500").getByRole("link", { name: "Helmholtz set HX-500" }).click();
    await page.getByRole("heading", { level: 1, name: "Helmholtz set HX-500" }).waitFor();
    await page.getByText(/pacemakers or other implants keep out of the test area/).waitFor();
    await page.getByRole("button", { name: "Record a calibration done here" }).click();
    await page.getByLabel("Certificate file").waitFor();
    expect(await page.getByLabel("Certificate file").getAttribute("accept")).toContain(".pdf");
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await h.shot(page, "instrument-helmholtz-phone");
    await page.close();
  });
});
