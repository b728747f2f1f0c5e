import { describe, expect, it } from "vitest";
import { TEST_PASSWORD, buildUser } from "../support/app";
import { useBrowser } from "../support/browser";

const h = useBrowser();

describe("the account page, as its user would", () => {
  it("changes the name, refuses a mismatched confirmation, changes the password", async () => {
    const user = await buildUser({ role: "operator", name: "Sam Tallow" });
    const { page, consoleErrors } = await h.newPage();
    await page.goto(`${h.baseUrl}/sign-in`);
    await page.getByLabel(/e-?mail/i).fill(user.email);
    await page.getByLabel(/^password/i).fill(TEST_PASSWORD);
    await page.getByRole("button", { name: /^sign in$/i }).click();
    await page.getByRole("heading", { level: 1, name: /welcome, sam tallow/i }).waitFor();

    await page.getByRole("navigation").getByRole("link", { name: /^account$/i }).click();
    await page.getByLabel(/^name$/i).fill("Sam Tallow-Reyes");
    await page.getByRole("button", { name: /save name/i }).click();
    await page.getByText(/your name is updated/i).waitFor();
    await page.getByText("Sam Tallow-Reyes").first().waitFor(); // the header follows

    await page.getByLabel(/current password/i).fill(TEST_PASSWORD);
    await page.getByLabel(/^new password/i).fill("a-fresh-long-password");
    await page.getByLabel(/repeat the new password/i).fill("a-different-password");
    await page.getByRole("button", { name: /change password/i }).click();
    await page.getByText(/not the same/i).waitFor();
    await page.getByLabel(/repeat the new password/i).fill("a-fresh-long-password");
    await page.getByRole("button", { name: /change password/i }).click();
    await page.getByText(/use the new password/i).waitFor();
    await h.shot(page, "account-changed");

    await page.getByRole("button", { name: /sign out/i }).click();
    await page.getByRole("link", { name: /^sign in$/i }).first().waitFor();
    await page.goto(`${h.baseUrl}/sign-in`);
    await page.getByLabel(/e-?mail/i).fill(user.email);
    await page.getByLabel(/^password/i).fill("a-fresh-long-password");
    await page.getByRole("button", { name: /^sign in$/i }).click();
    await page.getByRole("heading", { level: 1, name: /welcome, sam tallow-reyes/i }).waitFor();
    expect(consoleErrors).toEqual([]);
    await page.close();
  });
});
