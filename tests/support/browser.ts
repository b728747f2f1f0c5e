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
import { createHttpServer } from "../../server/http-server";

export const SCREENSHOTS = path.resolve(".test-results/screenshots");
export const DEMO_PASSWORD = "fluxwright-demo";
const axeSource = readFileSync(createRequire(import.meta.url).resolve("axe-core/axe.min.js"), "utf8");

/** axe-core's WCAG 2.x A and AA checks on the page as it stands; throws listing each violation. */
export async function expectAccessible(page: Page, where = page.url()): Promise<void> {
  // evaluated through the debugging protocol: the app's Content-Security-Policy (no inline scripts) stays on
  if (!(await page.evaluate(() => "axe" in window))) await page.evaluate(axeSource);
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(context: Document, options: object): Promise<{ violations: Array<{ id: string; help: string; nodes: Array<{ target: unknown[] }> }> }> } }).axe;
    const result = await axe.run(document, { runOnly: { type: "tag", values: ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"] } });
    return result.violations.map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).slice(0, 3).join("; ")})`);
  });
  if (violations.length) throw new Error(`axe found ${violations.length} accessibility violation(s) on ${where}:\n${violations.join("\n")}`);
}

export interface BrowserHarness {
  baseUrl: string;
  app: FluxwrightApp;
  context: BrowserContext;
  /**
   * A new page that records console errors and any request leaving the machine. axe-core checks each
   * page the test looks at (every `shot`) and the page as it is left (`close`).
   */
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
    await seedDemo(h.app.locals.deps.sequelize, { password: DEMO_PASSWORD, store: h.app.locals.deps.files });
    // served as server/index.ts serves it
    server = createHttpServer(h.app).listen(0, "127.0.0.1");
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
      const close = page.close.bind(page);
      page.close = async (options) => {
        if (!page.isClosed() && page.url().startsWith("http")) await expectAccessible(page);
        return close(options);
      };
      return { page, consoleErrors, offMachine };
    };
    h.shot = async (page, name) => {
      await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true });
      await expectAccessible(page, name);
    };
    h.axe = async (page, where) => {
      await expectAccessible(page, where);
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
