import { describe, expect, it } from "vitest";
import { DEMO_PASSWORD, useBrowser } from "../support/browser";
import { inbox } from "../support/app";

const h = useBrowser();

const demo = [
  { email: "customer@demo.test", role: "customer", heading: /welcome/i },
  { email: "operator@demo.test", role: "operator", heading: /welcome/i },
  { email: "qa@demo.test", role: "qa", heading: /welcome/i },
  { email: "admin@demo.test", role: "admin", heading: /welcome/i },
];

describe("demo users sign in through the form", () => {
  for (const d of demo) {
    it(`${d.role} lands on their home with no console errors and nothing leaving the machine`, async () => {
      const { page, consoleErrors, offMachine } = await h.newPage();
      await page.goto(`${h.baseUrl}/sign-in`);
      await page.getByLabel(/e-?mail/i).fill(d.email);
      await page.getByLabel(/^password/i).fill(DEMO_PASSWORD);
      await page.getByRole("button", { name: /^sign in$/i }).click();
      await page.getByRole("heading", { level: 1, name: d.heading }).waitFor();
      expect(new URL(page.url()).pathname).toBe("/");
      await h.shot(page, `home-${d.role}`);
      expect(consoleErrors).toEqual([]);
      expect(offMachine).toEqual([]);
      await page.getByRole("button", { name: /sign out/i }).click();
      await page.getByRole("link", { name: /^sign in$/i }).first().waitFor();
      await page.close();
    });
  }

  it("works from the keyboard alone: skip link, fields, Enter", async () => {
    const { page, consoleErrors } = await h.newPage();
    await page.goto(`${h.baseUrl}/sign-in`);
    await page.getByLabel(/e-?mail/i).focus();
    await page.keyboard.type("qa@demo.test");
    await page.keyboard.press("Tab");
    await page.keyboard.type(DEMO_PASSWORD);
    await page.keyboard.press("Enter");
    await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
    expect(consoleErrors).toEqual([]);
    await page.close();
  });

  it("a wrong password shows a message and stays on the form", async () => {
    const { page } = await h.newPage();
    await page.goto(`${h.baseUrl}/sign-in`);
    await page.getByLabel(/e-?mail/i).fill("customer@demo.test");
    await page.getByLabel(/^password/i).fill("not-the-password");
    await page.getByRole("button", { name: /^sign in$/i }).click();
    await page.getByText(/do not match/i).waitFor();
    await h.shot(page, "sign-in-wrong-password");
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await page.close();
  });
});

describe("a new user, as they would", () => {
  it("registers, signs out, resets the password from the mailed link and signs in again", async () => {
    const { page, consoleErrors } = await h.newPage();
    const email = `browser-${Date.now()}@example.test`;
    await page.goto(`${h.baseUrl}/register`);
    await page.getByLabel(/your name/i).fill("Noor Ellery");
    await page.getByLabel(/e-?mail/i).fill(email);
    await page.getByLabel(/organi[sz]ation/i).fill(`Ellery Magnetics ${Date.now()}`);
    await page.getByLabel(/^password/i).fill("a-long-password-1");
    await page.getByLabel(/confirm|repeat/i).fill("a-long-password-1");
    await h.shot(page, "register-filled");
    await page.getByRole("button", { name: /create account|register/i }).click();
    await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
    await page.getByRole("button", { name: /sign out/i }).click();
    await page.getByRole("link", { name: /^sign in$/i }).first().waitFor();
    // signed out on the server too, not only on the screen
    const after = await page.evaluate(() => fetch("/api/auth/session").then((r) => r.json()));
    expect(after.user).toBeNull();

    await page.goto(`${h.baseUrl}/forgot-password`);
    await page.getByLabel(/e-?mail/i).fill(email);
    await page.getByRole("button", { name: /send|reset/i }).click();
    await page.getByText(/on its way/i).waitFor();
    const mails = await inbox(h.app, email);
    const link = mails.map((m) => m.text.match(/https?:\/\/\S+\/reset-password\/[\w-]+/)?.[0]).find(Boolean)!;
    expect(link).toBeTruthy();
    await page.goto(`${h.baseUrl}${new URL(link).pathname}`);
    await page.getByLabel(/new password/i).first().fill("another-long-password");
    await page.getByLabel(/confirm|repeat/i).fill("another-long-password");
    await page.getByRole("button", { name: /set the new password/i }).click();
    await page.getByText(/password changed/i).waitFor();
    await page.getByRole("main").getByRole("link", { name: /^sign in$/i }).click();
    await page.getByRole("heading", { level: 1, name: /^sign in$/i }).waitFor();
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    await page.getByLabel(/e-?mail/i).fill(email);
    await page.getByLabel(/^password/i).fill("another-long-password");
    await page.getByRole("button", { name: /^sign in$/i }).click();
    await page.getByRole("heading", { level: 1, name: /welcome/i }).waitFor();
    await h.shot(page, "after-reset-home");

    // A reset made while still signed in signs this browser out as well.
    await page.goto(`${h.baseUrl}/forgot-password`);
    await page.getByLabel(/e-?mail/i).fill(email);
    await page.getByRole("button", { name: /send|reset/i }).click();
    await page.getByText(/on its way/i).waitFor();
    const second = (await inbox(h.app, email)).map((m) => m.text.match(/https?:\/\/\S+\/reset-password\/[\w-]+/)?.[0]).filter(Boolean).at(-1)!;
    expect(second).not.toBe(link);
    await page.goto(`${h.baseUrl}${new URL(second).pathname}`);
    await page.getByLabel(/new password/i).first().fill("a-third-long-password");
    await page.getByLabel(/confirm|repeat/i).fill("a-third-long-password");
    await page.getByRole("button", { name: /set the new password/i }).click();
    await page.getByText(/password changed/i).waitFor();
    await page.getByRole("main").getByRole("link", { name: /^sign in$/i }).click();
    await page.getByRole("heading", { level: 1, name: /^sign in$/i }).waitFor();
    expect(consoleErrors).toEqual([]);
    await page.close();
  });
});

describe("messages that do not give anything away, and links that say they are spent", () => {
  it("registering an address that already has an account looks like any registration; the page says to check the mail, nobody is signed in", async () => {
    const { page, consoleErrors } = await h.newPage();
    await page.goto(`${h.baseUrl}/register`);
    await page.getByLabel(/your name/i).fill("Someone Else");
    await page.getByLabel(/work email/i).fill("customer@demo.test");
    await page.getByLabel(/^organisation/i).fill(`Probe Ltd ${Date.now()}`);
    await page.getByLabel(/^password/i).fill("another-long-password");
    await page.getByLabel(/repeat the password/i).fill("another-long-password");
    await page.getByRole("button", { name: /create account/i }).click();
    await page.getByTestId("registration-mailed").getByText(/if the address already has a Fluxwright account/i).waitFor();
    // no "already exists": the page says the same as it would to anyone not signed in after registering
    expect(await page.getByText(/already exists|already has an account\./i).count()).toBe(0);
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: /^sign in$/i }).waitFor();
    await h.shot(page, "register-existing-address");
    expect(consoleErrors).toEqual([]);
    await page.close();
  });

  it("a bad or used reset link says so before any form", async () => {
    const { page } = await h.newPage();
    await page.goto(`${h.baseUrl}/reset-password/this-link-was-never-sent`);
    await page.getByTestId("reset-link-invalid").getByText(/expired or was already used/i).waitFor();
    expect(await page.getByLabel(/new password/i).count()).toBe(0);
    await page.getByRole("link", { name: /ask for a new link/i }).click();
    await page.getByRole("heading", { level: 1, name: /forgot your password/i }).waitFor();
    await page.close();
  });
});
