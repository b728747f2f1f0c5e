import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Event, Job } from "../../server/models";
import { buildTestApp } from "../support/app";
import { pdfBarcodes } from "../support/barcodes";
import { binary, ensureReferenceData, pdfPageSize, pdfText } from "../support/ordering";
import { buildHeat, buildReleasedOrder, customer, designs, scanThrough, staff } from "../support/shop-floor";

const app = buildTestApp();
beforeAll(ensureReferenceData);

const pdf = async (agent: ReturnType<typeof request.agent>, url: string) => {
  const res = await agent.get(url).buffer(true).parse(binary);
  return { status: res.status, type: res.headers["content-type"], body: res.body as Buffer };
};
const flat = (s: string) => s.replace(/\s+/g, " ");
const raw = (b: Buffer) => flat(pdfText(b, "raw"));

describe("GET /api/jobs/:id/traveler.pdf", { timeout: 30_000 }, () => {
  it("401; 403 for the ordering customer, 404 for another; 400 for an unknown paper size", async () => {
    const { jobs, buyer } = await buildReleasedOrder(app);
    const url = `/api/jobs/${jobs[0].id}/traveler.pdf`;
    expect((await request(app).get(url)).status).toBe(401);
    expect((await (await customer(app, buyer.organizationId)).agent.get(url)).status).toBe(403);
    expect((await (await customer(app)).agent.get(url)).status).toBe(404);
    const op = await staff(app, "operator");
    const res = await op.agent.get(`${url}?paper=A3`);
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("paper");
  });

  it("a drawn can: the job's Code 128 and one per step (read back by an independent decoder), part, layer, material, blank, draws, cautions, lines to sign; A4, or US Letter; each print is in the trail", async () => {
    const { jobs, order, lots } = await buildReleasedOrder(app);
    const job = jobs[0];
    const op = await staff(app, "operator");
    const a4 = await pdf(op.agent, `/api/jobs/${job.id}/traveler.pdf`);
    expect(a4.status).toBe(200);
    expect(a4.type).toBe("application/pdf");
    expect(pdfPageSize(a4.body)).toMatchObject({ width: 595.28, height: 841.89 });
    const text = flat(pdfText(a4.body));
    for (const s of [job.code, `O-${order.number}`, lots[0].number, "Layer 1 drawn can, deep drawn", "80", "1 mm", "2 pieces", "disc, dia.", "Material issue", "Blank", "Form", "Clean", "Hydrogen anneal", "Verify", "Pack", "Started", "Done", "init.", "Notes"]) {
      expect(text).toContain(s);
    }
    const form = job.routing.find((s) => s.key === "form")!;
    expect(text).toContain(`${form.drawStages} draw`);
    for (const key of job.routing.map((s) => s.key)) expect(text).toContain(`${job.code}-${key.toUpperCase()}`);
    // the cautions where the hazard is
    const sentences = raw(a4.body);
    expect(sentences).toMatch(/Press work: guards and interlocks in place/);
    expect(sentences).toMatch(/Hydrogen: follow NFPA 86 \(or EN 746-3 \/ the local code\) and site procedures/);
    expect(sentences).toMatch(/no bending, knocks, drops/);
    expect(pdfPageSize(a4.body).pages).toBe(1);
    // what a scanner reads: the job's code and each step's own barcode
    expect(pdfBarcodes(a4.body)).toEqual([job.code, ...job.routing.map((s) => `${job.code}-${s.key.toUpperCase()}`)]);

    const letter = await pdf(op.agent, `/api/jobs/${job.id}/traveler.pdf?paper=LETTER`);
    expect(pdfPageSize(letter.body)).toMatchObject({ width: 612, height: 792 });
    const prints = await Event.findAll({ where: { action: "job.traveler-printed", subjectId: job.id }, order: [["id", "ASC"]] });
    expect(prints.map((e) => e.data.paper)).toEqual(["A4", "LETTER"]);
    expect(prints[0].actorId).toBe(op.user.id);
  });

  it("a rolled wall says what is welded onto it and its weld; its end caps name the wall; the heat issued is printed", async () => {
    const { jobs } = await buildReleasedOrder(app, { configuration: designs.rolled() });
    const [wall, caps] = jobs;
    const op = await staff(app, "operator");
    const heat = await buildHeat();
    await scanThrough(op, wall, "material", heat.heatNumber);
    const text = raw((await pdf(op.agent, `/api/jobs/${wall.id}/traveler.pdf`)).body);
    expect(text).toContain(`Weld on ${caps.code}`);
    expect(text).toContain(`issued: heat ${heat.heatNumber}`);
    expect(text).toContain("rectangle,");
    const capText = flat(pdfText((await pdf(op.agent, `/api/jobs/${caps.id}/traveler.pdf`)).body));
    expect(capText).toContain(`Welded to ${wall.code}`);
    expect(capText).not.toContain("Hydrogen anneal");
  });
});

describe("lot labels and a lot's travelers", { timeout: 30_000 }, () => {
  it("a sheet of labels with the lot's Data Matrix, order, alloy, pieces and jobs; all travelers of a lot in one file; prints recorded", async () => {
    const { lots, jobs, order } = await buildReleasedOrder(app);
    const url = `/api/lots/${lots[0].id}/label.pdf`;
    expect((await request(app).get(url)).status).toBe(401);
    expect((await (await customer(app)).agent.get(url)).status).toBe(404);
    const op = await staff(app, "operator");
    const label = await pdf(op.agent, `${url}?paper=LETTER`);
    expect(label.status).toBe(200);
    expect(pdfPageSize(label.body)).toMatchObject({ width: 612, height: 792, pages: 1 });
    const text = flat(pdfText(label.body));
    expect(text).toContain(`LOT ${lots[0].number}`);
    expect(text).toContain(`Order O-${order.number}`);
    expect(text).toContain("4 pieces");
    expect(text).toContain(jobs[0].code);
    const codes = pdfBarcodes(label.body);
    expect(codes.length).toBeGreaterThanOrEqual(1);
    expect(new Set(codes)).toEqual(new Set([lots[0].number]));
    expect(await Event.count({ where: { action: "lot.label-printed", subjectId: lots[0].id } })).toBe(1);

    const all = await pdf(op.agent, `/api/lots/${lots[0].id}/travelers.pdf`);
    expect(all.status).toBe(200);
    const allText = flat(pdfText(all.body));
    for (const j of jobs) expect(allText).toContain(`${j.code}-PACK`);
    expect(await Event.count({ where: { action: "job.traveler-printed", subjectId: jobs.map((j) => j.id) } })).toBe(2);
  });
});

describe("PUT /api/jobs/:id/routing", { timeout: 30_000 }, () => {
  it("the planner edits the routing before work starts; the trade's order and the final anneal are kept; once scanned it is locked (409)", async () => {
    const { jobs, buyer } = await buildReleasedOrder(app);
    const job = jobs[0];
    const url = `/api/jobs/${job.id}/routing`;
    const steps = job.routing.map((s) => (s.key === "form" ? { ...s, drawStages: 3, processAnneals: 2, note: "Use the 62 mm redraw die" } : s));
    expect((await request(app).put(url).send({ steps })).status).toBe(401);
    const op = await staff(app, "operator");
    expect((await op.agent.put(url).set("X-CSRF-Token", op.csrf).send({ steps })).status).toBe(403);
    const own = await customer(app, buyer.organizationId);
    expect((await own.agent.put(url).set("X-CSRF-Token", own.csrf).send({ steps })).status).toBe(403);
    const stranger = await customer(app);
    expect((await stranger.agent.put(url).set("X-CSRF-Token", stranger.csrf).send({ steps })).status).toBe(404);
    const planner = await staff(app, "admin");
    const put = (body: object) => planner.agent.put(url).set("X-CSRF-Token", planner.csrf).send(body);
    let res = await put({ steps: [{ key: "material" }, { key: "paint" }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("steps.1.key");
    res = await put({ steps: steps.filter((s) => s.key !== "anneal") });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.steps).toMatch(/final hydrogen anneal/);
    res = await put({ steps: [steps[1], steps[0], ...steps.slice(2)] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields["steps.1.key"]).toMatch(/Material issue must come before Blank/);
    res = await put({ steps: steps.map((s) => (s.key === "form" ? { ...s, processAnneals: 3 } : s)) });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("steps.2.processAnneals");
    res = await put({ steps });
    expect(res.status).toBe(200);
    expect(res.body.steps[2]).toMatchObject({ key: "form", drawStages: 3, processAnneals: 2, note: "Use the 62 mm redraw die" });
    expect(res.body.part).toMatchObject({ drawStages: 3, processAnneals: 2 });
    expect(res.body.abilities.editRouting).toBe(true);
    // a weld may be added to a drawn can (a bracket welded on, say)
    const withWeld = [...steps.slice(0, 3), { key: "weld" }, ...steps.slice(3)];
    expect((await put({ steps: withWeld })).status).toBe(200);
    expect((await Job.findByPk(job.id))!.annealIndex).toBe(5);
    expect(raw((await pdf(planner.agent, `/api/jobs/${job.id}/traveler.pdf`)).body)).toContain("Planner: Use the 62 mm redraw die");

    await op.agent.post("/api/scans").set("X-CSRF-Token", op.csrf).send({ code: job.code, step: "material", action: "start", station: "stores" });
    res = await put({ steps });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("ROUTING_LOCKED");
    expect((await planner.agent.get(`/api/jobs/${job.id}`)).body.abilities.editRouting).toBe(false);
    expect(await Event.count({ where: { action: "job.routing-changed", subjectId: job.id } })).toBe(2);
  });
});
