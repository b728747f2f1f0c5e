// Chromium from Debian driven by playwright-core, against the built client served by the real server.
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { createRequire } from "node:module";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { afterAll, afterEach, beforeAll } from "vitest";
import { createApp, type FluxwrightApp } from "../../server/app";
import { seedDemo } from "../../server/db/seed";
import { closeSequelize } from "../../server/db/sequelize";
import { testConfig } from "./app";

export const SCREENSHOTS = path.resolve(".test-results/screenshots");
const axeSource = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");
export const DEMO_PASSWORD = "fluxwright-demo";

export interface BrowserHarness {
  baseUrl: string;
  app: FluxwrightApp;
  context: BrowserContext;
  /** a new page that records console errors and any request leaving the machine */
  newPage(): Promise<{ page: Page; consoleErrors: string[]; offMachine: string[] }>;
  shot(page: Page, name: string): Promise<void>;
  /** axe-core on the page as it stands: throws listing the violations (WCAG 2.x A and AA rules) */
  axe(page: Page, where: string): Promise<void>;
}

export function useBrowser(): BrowserHarness {
  const h = {} as BrowserHarness;
  let server: import("node:http").Server;
  let profile: string;
  let lastPage: Page | undefined;
  // A failing test leaves a picture of where it stood.
  afterEach(async (ctx) => {
    if (ctx.task.result?.state === "fail" && lastPage && !lastPage.isClosed()) {
      await lastPage.screenshot({ path: path.join(SCREENSHOTS, `FAILED-${ctx.task.name.replace(/\W+/g, "-").slice(0, 80)}.png`), fullPage: true }).catch(() => {});
    }
  });
  beforeAll(async () => {
    const config = testConfig({ RATE_LIMIT_PUBLIC: "0" });
    h.app = createApp({ config, serveClient: true });
    await seedDemo(h.app.locals.deps.sequelize, { password: DEMO_PASSWORD });
    server = h.app.listen(0, "127.0.0.1");
    await new Promise((r) => server.once("listening", r));
    h.baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    profile = mkdtempSync(path.join(tmpdir(), "fw-chromium-"));
    mkdirSync(SCREENSHOTS, { recursive: true });
    h.context = await chromium.launchPersistentContext(profile, {
      executablePath: "/usr/bin/chromium",
      headless: true,
      viewport: { width: 1280, height: 860 },
      args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
    });
    h.newPage = async () => {
      await h.context.clearCookies(); // every page starts signed out, whatever the test before it did
      const page = await h.context.newPage();
      lastPage = page;
      const consoleErrors: string[] = [];
      const offMachine: string[] = [];
      page.on("console", (m) => { if (m.type() === "error") consoleErrors.push(m.text()); });
      page.on("pageerror", (e) => consoleErrors.push(String(e)));
      page.on("request", (r) => {
        const u = new URL(r.url());
        if (!["127.0.0.1", "localhost"].includes(u.hostname) && !["data:", "blob:"].includes(u.protocol)) offMachine.push(r.url());
      });
      return { page, consoleErrors, offMachine };
    };
    h.shot = async (page, name) => { await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true }); };
    h.axe = async (page, where) => {
      // evaluated through the debugging protocol, so the page's content security policy does not block it
      if (!(await page.evaluate(() => "axe" in window))) await page.evaluate(axeSource);
      const violations = await page.evaluate(async () => {
        const axe = (window as unknown as { axe: { run: (ctx: Document, opts: object) => Promise<{ violations: { id: string; help: string; nodes: { target: string[] }[] }[] }> } }).axe;
        const result = await axe.run(document, { runOnly: { type: "tag", values: ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"] }, resultTypes: ["violations"] });
        return result.violations.map((v) => `${v.id}: ${v.help} at ${v.nodes.slice(0, 3).map((n) => n.target.join(" ")).join("; ")}`);
      });
      if (violations.length) throw new Error(`accessibility (${where}): ${violations.join(" | ")}`);
    };
  });
  afterAll(async () => {
    await h.context?.close();
    await new Promise((r) => server?.close(r));
    await h.app?.locals.close();
    await closeSequelize();
    if (profile) rmSync(profile, { recursive: true, force: true });
  });
  return h;
}
