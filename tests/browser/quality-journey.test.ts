// The QA journey in Chromium: a lot's plan shown, some readings typed, the rest uploaded as CSV,
// the lot accepted, the certificate issued and mailed; the customer downloads it; the public
// check opened from the PDF's QR code shows it valid and current, then superseded by a revision.
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { User } from "../../server/models";
import { inbox } from "../support/app";
import { pdfBarcodes } from "../support/barcodes";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";
import { ensureReferenceData } from "../support/ordering";
import { buildInstrument, buildLotAtVerify } from "../support/quality";
import { staff } from "../support/shop-floor";

const h = useBrowser();
beforeAll(ensureReferenceData);

async function signInAs(page: Page, email: string) {
  await h.context.clearCookies();
  await page.goto(`${h.baseUrl}/sign-in`);
  await page.getByLabel(/e-?mail/i).fill(email);
  await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: /^sign in$/i }).click();
  await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
}

describe("inspecting a lot and certifying it", () => {
  it("measures from the plan (by hand and by CSV), accepts, issues, mails; the customer downloads; the QR code's page shows it valid, then superseded", { timeout: 180_000 }, async () => {
    const buyer = (await User.findOne({ where: { email: "customer@demo.test" } }))!;
    const { lot } = await buildLotAtVerify(h.app, { quantity: 20, buyer });
    const probe = await buildInstrument({ name: `Journey fluxgate ${lot.number}` });
    const { page, consoleErrors } = await h.newPage();

    await signInAs(page, "qa@demo.test");
    await page.goto(`${h.baseUrl}/quality/lots`);
    await page.getByRole("link", { name: lot.number }).click();
    await page.getByTestId("sampling-plan").waitFor();
    const sample = Number((await page.getByTestId("sample-progress").textContent())!.match(/of (\d+)/)![1]);
    expect(sample).toBeGreaterThan(2);
    await h.shot(page, "quality-lot-plan");

    // two readings typed: Enter records each, the serial moves on, the cursor returns to the inside field
    const inside = page.getByRole("textbox", { name: /field inside/i });
    await page.getByLabel("Instrument").selectOption(probe.id);
    for (const value of ["0.5", "0.4"]) {
      await inside.fill(value);
      await inside.press("Enter");
      await expect.poll(() => page.getByRole("status").filter({ hasText: /dB/ }).count()).toBeGreaterThan(0);
    }
    await expect.poll(() => page.getByTestId("sample-progress").textContent()).toMatch(/^2 of/);
    await h.shot(page, "quality-lot-typed");

    // the rest from a CSV, first with one bad row: nothing stored, the row named
    const rows = Array.from({ length: sample - 2 }, (_, i) => `${lot.number}-C${i + 1},60,100 uT,${i === 0 ? "0" : "0.45"} uT,${probe.name}`);
    const csv = (lines: string[]) => ({ name: "readings.csv", mimeType: "text/csv", buffer: Buffer.from(`serial,frequency_hz,appliedField,insideField,instrument\n${lines.join("\n")}\n`) });
    await page.getByLabel("File of readings").setInputFiles(csv(rows));
    await page.getByRole("button", { name: "Upload readings" }).click();
    await page.getByTestId("csv-problems").waitFor();
    expect(await page.getByTestId("csv-problems").textContent()).toMatch(/row 2/);
    await h.shot(page, "quality-lot-csv-refused");
    await page.getByLabel("File of readings").setInputFiles(csv(rows.map((r) => r.replace(",0 uT,", ",0.45 uT,"))));
    await page.getByRole("button", { name: "Upload readings" }).click();
    await page.getByTestId("lot-decision").waitFor();
    expect(await page.getByTestId("lot-decision").textContent()).toMatch(/accepted/);

    await page.getByRole("button", { name: "Issue the certificate" }).click();
    await page.getByTestId("certificates").waitFor();
    const digest = (await page.getByTestId("certificates").textContent())!.match(/[0-9a-f]{64}/)![0];
    await h.shot(page, "quality-lot-certified");
    const mails = await inbox(h.app, "customer@demo.test");
    expect(mails.some((m) => m.subject.includes(lot.number) && m.attachments.some((a) => a.contentType === "application/pdf"))).toBe(true);

    // the customer downloads it from their certificates
    await signInAs(page, "customer@demo.test");
    await page.goto(`${h.baseUrl}/certificates`);
    const row = page.getByTestId("certificate-row").filter({ hasText: lot.number });
    await row.first().waitFor();
    await h.shot(page, "customer-certificates");
    const href = await row.first().getByRole("link", { name: /download/i }).getAttribute("href");
    const download = await page.request.get(`${h.baseUrl}${href}`);
    expect(download.headers()["content-type"]).toMatch(/application\/pdf/);
    const pdf = Buffer.from(await download.body());

    // the QR code in the PDF leads to the public check (no sign-in)
    const read = pdfBarcodes(pdf);
    const qr = read.find((t) => t.includes("/verify/"));
    expect(qr, `barcodes read from the certificate: ${JSON.stringify(read)}`).toBeTruthy();
    await h.context.clearCookies();
    await page.goto(`${h.baseUrl}${new URL(qr!).pathname}`);
    await page.getByTestId("verification").waitFor();
    expect(await page.getByTestId("verification").textContent()).toMatch(/current revision/);
    // every measured part it certifies, as the certificate lists them
    const measured = Number((await page.getByTestId("verification").textContent())!.match(/(\d+) measured, \d+ failing/)![1]);
    expect(measured).toBeGreaterThan(0);
    expect(await page.getByTestId("certified-part").count()).toBe(measured);
    await h.shot(page, "verify-current");
    // the file itself, dropped on the page
    await page.getByLabel("Certificate PDF").setInputFiles({ name: "certificate.pdf", mimeType: "application/pdf", buffer: pdf });
    await page.getByText(/is exactly the file issued/).waitFor();

    // a revision supersedes it: the first now shows as superseded
    const qa = await staff(h.app, "qa");
    const certificateId = href!.match(/certificates\/([^.]+)\.pdf/)![1];
    const revised = await qa.agent.post(`/api/certificates/${certificateId}/revisions`).set("X-CSRF-Token", qa.csrf).send({ reason: "Purchase order reference corrected" });
    expect(revised.status).toBe(201);
    await page.goto(`${h.baseUrl}/verify/${digest}`);
    await page.getByTestId("verification").waitFor();
    expect(await page.getByTestId("verification").textContent()).toMatch(/superseded by revision 2/);
    await h.shot(page, "verify-superseded");
    expect(consoleErrors.filter((e) => !/status of (404|400)/.test(e)).join("\n")).toBe("");
    await page.close();
  });
});
