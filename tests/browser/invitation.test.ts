import { describe, expect, it } from "vitest";
import { inbox } from "../support/app";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";

const h = useBrowser();

describe("the planner invites a customer engineer, as they would", () => {
  it("sends the invitation from Users; the invited person joins from the mailed link", async () => {
    const { page, consoleErrors, offMachine } = await h.newPage();
    const email = `invited-${Date.now()}@example.test`;
    await page.goto(`${h.baseUrl}/sign-in`);
    await page.getByLabel(/e-?mail/i).fill("admin@demo.test");
    await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: /^sign in$/i }).click();
    await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();

    await page.getByRole("navigation").getByRole("link", { name: /^users$/i }).click();
    await page.getByLabel(/^email$/i).fill(email);
    await page.getByLabel(/^role$/i).selectOption("customer");
    await page.getByLabel(/customer organisation/i).selectOption({ label: "Quillbrook Beam Lab (demo)" });
    await page.getByRole("button", { name: /send invitation/i }).click();
    await page.getByText(/invitation sent/i).waitFor();
    // the pending list names the organisation the person will join
    const pending = page.getByRole("listitem").filter({ hasText: email });
    await pending.getByText(/Customer · Quillbrook Beam Lab \(demo\) · expires/).waitFor({ timeout: 5000 });
    expect(await pending.count()).toBe(1);
    await h.shot(page, "admin-users-invited");
    await page.getByRole("button", { name: /sign out/i }).click();
    await page.getByRole("link", { name: /^sign in$/i }).first().waitFor();

    const [mail] = await inbox(h.app, email);
    expect(mail.subject).toMatch(/invited/i);
    const link = mail.text.match(/https?:\/\/\S+\/invitation\/[\w-]+/)![0];
    await page.goto(`${h.baseUrl}${new URL(link).pathname}`);
    await page.getByText(email).first().waitFor();
    await page.getByLabel(/your name/i).fill("Oda Brightwell");
    await page.getByLabel(/^password$/i).fill("a-long-password-2");
    await page.getByLabel(/repeat the password/i).fill("a-long-password-2");
    await h.shot(page, "invitation-accept");
    await page.getByRole("button", { name: /accept and sign in/i }).click();
    await page.getByRole("heading", { level: 1, name: /welcome, oda brightwell/i }).waitFor();
    await page.getByRole("main").getByText(/quillbrook beam lab/i).first().waitFor(); // the organisation joined, on the home page
    await h.shot(page, "invited-customer-home");
    expect(consoleErrors).toEqual([]);
    expect(offMachine).toEqual([]);
    await page.close();
  });
});
