// The shop floor in Chromium as its people use it: the planner releases a paid order at a laptop's
// size; the operator scans its traveler codes through the keyboard field on a tablet (820 × 1180),
// goes offline and scans on, comes back and sees the queue sent once; a furnace run outside the
// window puts the lot on hold, the board shows it, and the planner releases the hold.
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { documentNumber } from "../../shared/schemas/documents";
import { Job, Lot, MaterialHeat, Order, Scan, User } from "../../server/models";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";
import { buildPaidOrder, waitFor } from "../support/ordering";
import { arrangeFinished, arrangeReadyForFurnace, buildHeat, buildReleasedOrder } from "../support/shop-floor";

const h = useBrowser();
const TABLET = { width: 820, height: 1180 };
const LAPTOP = { width: 1366, height: 900 };

async function signInAs(page: Page, role: "operator" | "admin") {
  await page.goto(`${h.baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill(`${role}@demo.test`);
  await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: /^sign in$/i }).click();
  await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
}

/** What a keyboard-wedge scanner does: types the code into the focused field and presses Enter. */
async function wedge(page: Page, code: string) {
  await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe("scan-field");
  await page.keyboard.type(code);
  await page.keyboard.press("Enter");
}

const queued = (page: Page) => page.getByTestId("queued-count").textContent();

describe("the shop floor, release to hold", () => {
  it("releases, scans online and offline with one event per scan, records a run outside the window and releases the hold", { timeout: 240_000 }, async () => {
    const buyer = (await User.findOne({ where: { email: "customer@demo.test" } }))!;
    const paid = await buildPaidOrder(h.app, buyer, { quantity: 2 });
    const orderNumber = documentNumber("order", paid.number);

    // --- the planner releases the paid order (laptop) ---
    const { page, consoleErrors } = await h.newPage();
    await page.setViewportSize(LAPTOP);
    await signInAs(page, "admin");
    await page.goto(`${h.baseUrl}/floor/release`);
    const row = page.getByTestId("paid-order").filter({ hasText: orderNumber });
    await row.getByRole("button", { name: /release to the floor/i }).click();
    await h.shot(page, "floor-release-confirm");
    await row.getByRole("button", { name: /yes, release/i }).click();
    await page.getByTestId("released-note").filter({ hasText: orderNumber }).waitFor();
    await h.shot(page, "floor-release-done");

    const jobs = await Job.findAll({ where: { orderId: paid.id }, order: [["seq", "ASC"]] });
    expect(jobs.length).toBeGreaterThan(0);
    const job = jobs[0];
    const lot = (await Lot.findByPk(job.lotId))!;

    // the job's page: its routing, and the traveler as a PDF
    await page.getByRole("link", { name: job.code, exact: true }).first().click();
    await page.getByRole("heading", { level: 1, name: `Job ${job.code}` }).waitFor();
    const traveler = page.getByTestId("traveler-links").getByRole("link", { name: /A4/ });
    const pdf = await page.request.get(new URL((await traveler.getAttribute("href"))!, h.baseUrl).toString());
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()["content-type"]).toMatch(/application\/pdf/);
    expect((await pdf.body()).subarray(0, 5).toString()).toBe("%PDF-");
    await h.shot(page, "floor-job-laptop");
    await page.close();

    // --- the operator at the station (tablet) ---
    const heat = await buildHeat({ materialId: job.materialId, thicknessMm: Number(job.thicknessMm) });
    const op = await h.newPage();
    const station = op.page;
    await station.setViewportSize(TABLET);
    await signInAs(station, "operator");
    await station.goto(`${h.baseUrl}/floor/scan`);
    await wedge(station, job.code.toLowerCase()); // scanners may send lower case
    await station.getByTestId("station-job").getByRole("heading", { name: job.code }).waitFor();
    await station.getByRole("button", { name: /^start material issue$/i }).click();
    await station.getByLabel(/heat number on the sheet/i).fill(heat.heatNumber);
    await h.shot(station, "scan-station-heat-prompt");
    await station.getByRole("button", { name: /record start/i }).click();
    await station.getByTestId("scan-recorded").filter({ hasText: /start of material issue/i }).waitFor();

    await wedge(station, `${job.code}-MATERIAL`); // the step's barcode completes it (the heat is linked)
    await station.getByTestId("scan-recorded").filter({ hasText: /completion of material issue/i }).waitFor();
    await h.shot(station, "scan-station-recorded");

    await wedge(station, `${job.code}-MATERIAL`); // again: already recorded, nothing new
    await station.getByTestId("scan-repeat").waitFor();
    await wedge(station, `${job.code}-WELD`); // a later step: refused with the reason
    const refused = station.getByTestId("scan-refused");
    await refused.waitFor();
    expect(await refused.textContent()).toMatch(/cannot start yet|has no weld step/i);
    await h.shot(station, "scan-station-refused");
    expect(await Scan.count({ where: { jobId: job.id } })).toBe(2);

    // --- offline: the scans wait on the device ---
    await h.context.setOffline(true);
    await station.getByTestId("network-state").filter({ hasText: "Offline" }).waitFor();
    await station.getByRole("button", { name: /^start blank$/i }).click();
    await expect.poll(() => queued(station)).toMatch(/^1 scan waiting/);
    await wedge(station, `${job.code}-BLANK`); // shown as started on the device, so this completes it
    await expect.poll(() => queued(station)).toMatch(/^2 scans waiting/);
    await h.shot(station, "scan-station-offline");
    expect(await Scan.count({ where: { jobId: job.id } })).toBe(2);

    // --- back online: the queue is sent once, in order ---
    await h.context.setOffline(false);
    await expect.poll(() => queued(station), { timeout: 20_000 }).toBe("No scans waiting");
    await h.shot(station, "scan-station-replayed");
    const scans = await Scan.findAll({ where: { jobId: job.id }, order: [["createdAt", "ASC"]] });
    expect(scans.map((s) => `${s.step}:${s.action}`)).toEqual(["material:start", "material:complete", "blank:start", "blank:complete"]);
    expect(new Set(scans.map((s) => s.idempotencyKey)).size).toBe(4);
    expect(op.consoleErrors.filter((e) => !/status of (404|409)|ERR_INTERNET_DISCONNECTED|Failed to fetch/.test(e))).toEqual([]);
    await station.close();

    // --- a furnace run outside the window puts the lot on hold (tablet) ---
    await arrangeReadyForFurnace(lot.id);
    const furnace = await h.newPage();
    const fp = furnace.page;
    await fp.setViewportSize(TABLET);
    await signInAs(fp, "admin");
    await fp.goto(`${h.baseUrl}/floor`);
    await fp.getByTestId("waiting-lots").getByText(lot.number).waitFor();
    await fp.goto(`${h.baseUrl}/floor/furnace`);
    await fp.getByTestId("furnace-form").getByText(lot.number).click();
    await fp.getByLabel(/^setpoint/i).fill("1150");
    await fp.getByLabel(/^measured peak/i).fill("1195");
    await fp.getByLabel(/^time at temperature/i).fill("180");
    await fp.getByLabel(/^dew point in/i).fill("-50");
    await fp.getByLabel(/^cooling rate/i).fill("200");
    await fp.getByTestId("window-check").getByText(/above the window/i).waitFor();
    await h.shot(fp, "furnace-outside-window");
    await fp.getByRole("button", { name: /record the run/i }).click();
    await fp.getByRole("button", { name: /yes, record it/i }).click();
    await fp.getByTestId("run-result").filter({ hasText: /outside the window/i }).waitFor();
    await h.shot(fp, "furnace-run-on-hold");

    // the board shows the hold; the planner releases it on the lot's page
    await fp.goto(`${h.baseUrl}/floor`);
    await fp.getByTestId("holds").getByText(lot.number).waitFor();
    await h.shot(fp, "floor-board-hold-tablet");
    await fp.getByTestId("holds").getByRole("link", { name: lot.number }).click();
    await fp.getByTestId("hold-reason").waitFor();
    await fp.getByLabel(/why the lot may go on/i).fill("Peak 15 °C over for under 5 minutes; producer confirms properties unaffected.");
    await fp.getByRole("button", { name: /release the hold/i }).click();
    await fp.getByRole("button", { name: /yes, release/i }).click();
    await fp.getByText(/is released; its jobs can be scanned again/i).waitFor();
    await h.shot(fp, "floor-lot-hold-released");
    await waitFor(async () => !(await Lot.findByPk(lot.id))!.holdReason, 5000, "the hold to be released");
    await fp.goto(`${h.baseUrl}/floor`);
    await fp.getByTestId("wip-tiles").waitFor();
    expect(await fp.getByTestId("holds").getByText(lot.number).count()).toBe(0);
    expect(consoleErrors.filter((e) => !/status of 404/.test(e))).toEqual([]);
    await fp.close();
  });

  it("keeps the board's filters in the address: a step tile filters the jobs and a reload keeps it", async () => {
    const { page } = await h.newPage();
    await page.setViewportSize(TABLET);
    await signInAs(page, "operator");
    await page.goto(`${h.baseUrl}/floor`);
    await page.getByTestId("wip-anneal").click();
    await page.waitForURL(/step=anneal/);
    await page.getByLabel(/late only/i).click();
    await page.waitForURL(/late=true/);
    await page.reload();
    expect(await page.getByLabel(/at step/i).inputValue()).toBe("anneal");
    expect(await page.getByLabel(/late only/i).isChecked()).toBe(true);
    await page.getByLabel(/late only/i).click();
    await page.waitForURL((u) => !u.search.includes("late="));
    await page.getByTestId("floor-jobs").waitFor();
    const steps = await page.getByTestId("floor-job").allTextContents();
    expect(steps.length).toBeGreaterThan(0);
    for (const text of steps) expect(text).toMatch(/Hydrogen anneal/);
    await h.shot(page, "floor-board-filtered-tablet");
    await page.close();
  });

  it("receives a heat with its mill certificate and ships packed lots (the planner, laptop)", async () => {
    const buyer = (await User.findOne({ where: { email: "customer@demo.test" } }))!;
    const { order, lots } = await buildReleasedOrder(h.app, { buyer });
    for (const lot of lots) await arrangeFinished(lot.id);
    const { page, consoleErrors } = await h.newPage();
    await page.setViewportSize(LAPTOP);
    await signInAs(page, "admin");

    await page.goto(`${h.baseUrl}/floor/heats`);
    const form = page.getByTestId("heat-form");
    await form.getByRole("button", { name: /record the delivery/i }).click();
    await form.getByText(/give the heat number/i).waitFor(); // refused beside the field, nothing recorded
    const heatNumber = `HB${Date.now().toString(36).toUpperCase()}`;
    await form.getByLabel(/^heat number/i).fill(heatNumber);
    await form.getByLabel(/^alloy/i).selectOption("ni80");
    await form.getByLabel(/^gauge/i).fill("1");
    await form.getByLabel(/^supplier/i).fill("Northgate Strip (demo)");
    await form.getByLabel(/^quantity received/i).fill("12");
    await form.getByLabel(/mill certificate/i).setInputFiles({ name: "cert.pdf", mimeType: "application/pdf", buffer: Buffer.from("%PDF-1.4\n1 0 obj<<>>endobj\ntrailer<<>>\n%%EOF\n") });
    await form.getByRole("button", { name: /record the delivery/i }).click();
    await page.getByText(`Heat ${heatNumber} received with its mill certificate.`).waitFor();
    await page.getByTestId("heats-table").getByText(heatNumber).waitFor();
    await h.shot(page, "floor-heats-laptop");
    expect((await MaterialHeat.findOne({ where: { heatNumber } }))!.millCertificateFileId).toBeTruthy();

    await page.goto(`${h.baseUrl}/floor/shipping`);
    const parcel = page.getByTestId("ship-form").filter({ hasText: lots[0].number });
    await parcel.getByLabel(/^carrier/i).fill("Parcel carrier (demo)");
    await parcel.getByLabel(/^tracking number/i).fill("TRK-0001-DEMO");
    await parcel.getByRole("button", { name: /record the shipment/i }).click();
    await page.getByRole("button", { name: /yes, it has left/i }).click();
    await page.getByTestId("shipped-note").filter({ hasText: /order is complete/i }).waitFor();
    await h.shot(page, "floor-shipping-laptop");
    expect((await Order.findByPk(order.id))!.status).toBe("shipped");
    expect(consoleErrors.filter((e) => !/status of (400|404)/.test(e))).toEqual([]);
    await page.close();
  });
});
