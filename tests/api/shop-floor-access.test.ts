// Who may reach the shop floor's routes, all in one place: signed out 401; a customer of the
// ordering organisation 403 (its order names the lots), of another organisation 404; unknown ids 404.
import { randomUUID } from "node:crypto";
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { buildTestApp } from "../support/app";
import { ensureReferenceData } from "../support/ordering";
import { buildHeat, buildReleasedOrder, customer, staff } from "../support/shop-floor";

const app = buildTestApp();
beforeAll(ensureReferenceData);

describe("shop-floor routes: 401, 403, 404", { timeout: 30_000 }, () => {
  it("lots, their labels, travelers and holds; jobs; heats; furnace runs; release", async () => {
    const { lots, jobs, buyer, order } = await buildReleasedOrder(app);
    const heat = await buildHeat();
    const own = await customer(app, buyer.organizationId);
    const stranger = await customer(app);
    const op = await staff(app, "operator");
    const lot = lots[0].id;
    const reads = [`/api/lots/${lot}`, `/api/lots/${lot}/label.pdf`, `/api/lots/${lot}/travelers.pdf`, `/api/jobs/${jobs[0].id}`, `/api/jobs/${jobs[0].id}/traveler.pdf`];
    for (const url of [...reads, "/api/lots", "/api/jobs", "/api/heats", `/api/heats/${heat.id}`, "/api/furnace-runs", "/api/furnaces", "/api/floor"]) {
      expect((await request(app).get(url)).status, url).toBe(401);
    }
    for (const url of reads) {
      expect((await own.agent.get(url)).status, url).toBe(403);
      expect((await stranger.agent.get(url)).status, url).toBe(404);
    }
    for (const url of ["/api/lots", "/api/jobs", "/api/heats", `/api/heats/${heat.id}`, "/api/furnace-runs", "/api/floor"]) expect((await own.agent.get(url)).status, url).toBe(403);
    for (const url of [`/api/lots/${randomUUID()}`, `/api/jobs/${randomUUID()}`, `/api/heats/${randomUUID()}`, `/api/furnace-runs/${randomUUID()}`, `/api/lots/x/label.pdf`, `/api/furnace-runs/x`]) {
      expect((await op.agent.get(url)).status, url).toBe(404);
    }
    const post = (who: typeof own, url: string, body: object = { reason: "Checking access" }) => who.agent.post(url).set("X-CSRF-Token", who.csrf).send(body);
    expect((await request(app).post(`/api/lots/${lot}/hold`).send({ reason: "x" })).status).toBe(401);
    expect((await post(own, `/api/lots/${lot}/hold`)).status).toBe(403);
    expect((await post(stranger, `/api/lots/${lot}/hold`)).status).toBe(404);
    expect((await post(stranger, `/api/lots/${lot}/hold-release`)).status).toBe(404);
    expect((await post(stranger, `/api/orders/${order.id}/release`, {})).status).toBe(404);
    expect((await post(own, `/api/orders/${order.id}/release`, {})).status).toBe(403);
    expect((await post(own, `/api/jobs/${jobs[0].id}/routing`, {})).status).toBe(404); // there is no such POST route
    expect((await post(op, `/api/lots/${randomUUID()}/hold`)).status).toBe(404);
  });
});
