import { createHash } from "node:crypto";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { MAX_DRAWING_BYTES } from "../../shared/schemas/order";
import { Order, StoredFile } from "../../server/models";
import { buildOrganization, buildTestApp, buildUser, signIn } from "../support/app";
import { binary, buildOrder, ensureReferenceData } from "../support/ordering";

const app = buildTestApp();
beforeAll(ensureReferenceData);

// Small but real files of each kind, by their signatures and headers.
const files = {
  pdf: Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n"),
  dxf: Buffer.from("999\nmade by hand\n  0\nSECTION\n  2\nENTITIES\n  0\nLINE\n  8\n0\n 10\n0\n 20\n0\n 11\n10\n 21\n10\n  0\nENDSEC\n  0\nEOF\n"),
  step: Buffer.from("ISO-10303-21;\nHEADER;\nFILE_DESCRIPTION(('can'),'2;1');\nENDSEC;\nDATA;\nENDSEC;\nEND-ISO-10303-21;\n"),
  png: Buffer.from("89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6300010000050001", "hex"),
  exe: Buffer.concat([Buffer.from("MZ"), Buffer.alloc(58), Buffer.from([0x80, 0, 0, 0]), Buffer.alloc(64), Buffer.from("PE\0\0"), Buffer.alloc(200)]),
  elf: Buffer.concat([Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]), Buffer.alloc(120)]),
};
const sha = (b: Buffer) => createHash("sha256").update(b).digest("hex");

async function customer() {
  const user = await buildUser({ role: "customer" });
  return { user, ...(await signIn(app, user)) };
}

describe("POST /api/orders/:id/files", () => {
  it("401, 403 without CSRF and for an operator, 404 across organisations (nothing stored)", async () => {
    const { user, agent } = await customer();
    const order = await buildOrder(app, user);
    const before = await StoredFile.count();
    expect((await request(app).post(`/api/orders/${order.id}/files`).attach("file", files.pdf, "a.pdf")).status).toBe(401);
    expect((await agent.post(`/api/orders/${order.id}/files`).attach("file", files.pdf, "a.pdf")).status).toBe(403);
    const shop = await buildOrganization({ kind: "shop" });
    const operator = await signIn(app, await buildUser({ role: "operator", organizationId: shop.id }));
    expect((await operator.agent.post(`/api/orders/${order.id}/files`).set("X-CSRF-Token", operator.csrf).attach("file", files.pdf, "a.pdf")).status).toBe(403);
    const stranger = await customer();
    expect((await stranger.agent.post(`/api/orders/${order.id}/files`).set("X-CSRF-Token", stranger.csrf).attach("file", files.pdf, "a.pdf")).status).toBe(404);
    expect(await StoredFile.count()).toBe(before);
  });

  it("201: PDF, DXF, STEP and an image, typed by content, kept under random names outside the web root with their SHA-256; downloads as attachments to the owner and staff only", async () => {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user);
    const res = await agent
      .post(`/api/orders/${order.id}/files`)
      .set("X-CSRF-Token", csrf)
      .attach("file", files.pdf, { filename: "can drawing rev B.pdf", contentType: "application/octet-stream" })
      .attach("file", files.dxf, "flat.dxf")
      .attach("file", files.step, "can.stp")
      .attach("file", files.png, "photo.png");
    expect(res.status).toBe(201);
    expect(res.body.files.map((f: { filename: string; contentType: string }) => [f.filename, f.contentType])).toEqual([
      ["can drawing rev B.pdf", "application/pdf"],
      ["flat.dxf", "application/dxf"],
      ["can.stp", "model/step"],
      ["photo.png", "image/png"],
    ]);
    expect(res.body.files[0].sha256).toBe(sha(files.pdf));
    const stored = await StoredFile.findByPk(res.body.files[0].id);
    expect(stored!.storageKey).toMatch(/^[0-9a-f]{2}\/[0-9a-f]{40}$/);
    const root = app.locals.deps.files.root;
    expect(root).not.toContain(`${path.sep}dist`);
    expect(readFileSync(path.join(root, stored!.storageKey)).equals(files.pdf)).toBe(true);
    expect(readdirSync(app.locals.deps.files.incoming)).toEqual([]); // nothing left behind

    const url = res.body.files[0].url;
    const download = await agent.get(url).buffer(true).parse(binary);
    expect(download.status).toBe(200);
    expect(download.headers["content-disposition"]).toMatch(/^attachment; filename="can drawing rev B.pdf"/);
    expect(download.headers["content-type"]).toBe("application/pdf");
    expect(download.headers["x-content-type-options"]).toBe("nosniff");
    expect((download.body as Buffer).equals(files.pdf)).toBe(true);
    expect((await request(app).get(url)).status).toBe(401);
    expect((await (await customer()).agent.get(url)).status).toBe(404);
    const shop = await buildOrganization({ kind: "shop" });
    const qa = await signIn(app, await buildUser({ role: "qa", organizationId: shop.id }));
    expect((await qa.agent.get(url)).status).toBe(200);
    const detail = (await agent.get(`/api/orders/${order.id}`)).body;
    expect(detail.files).toHaveLength(4);
    expect(detail.timeline.filter((t: { action: string }) => t.action === "drawing.uploaded")).toHaveLength(4);
  });

  it("refuses an empty file, one over 20 MB, a disguised program, a mismatched extension and a path in the name, each naming the field", async () => {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user);
    const up = (buffer: Buffer, options: string | { filename?: string; filepath?: string; contentType?: string }) =>
      agent.post(`/api/orders/${order.id}/files`).set("X-CSRF-Token", csrf).attach("file", buffer, options);
    let res = await up(Buffer.alloc(0), "empty.pdf");
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/empty/);
    res = await up(Buffer.concat([files.pdf, Buffer.alloc(MAX_DRAWING_BYTES + 1 - files.pdf.length)]), "huge.pdf");
    expect(res.status).toBe(413);
    expect(res.body.error.fields.file).toMatch(/20 MB/);
    res = await up(files.exe, { filename: "drawing.pdf", contentType: "application/pdf" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/Windows program/);
    res = await up(files.elf, "model.step");
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/program|not a PDF/);
    res = await up(files.png, "drawing.pdf");
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/PNG image but the name ends in \.pdf/);
    res = await up(Buffer.from("just some notes"), "notes.txt");
    expect(res.status).toBe(400);
    res = await up(files.pdf, { filepath: "../../etc/drawing.pdf" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toMatch(/folder path/);
    res = await agent.post(`/api/orders/${order.id}/files`).set("X-CSRF-Token", csrf).attach("drawing", files.pdf, "a.pdf");
    expect(res.status).toBe(400);
    res = await agent.post(`/api/orders/${order.id}/files`).set("X-CSRF-Token", csrf).field("note", "no file");
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty("file");
    expect((await agent.get(`/api/orders/${order.id}`)).body.files).toEqual([]);
    expect(readdirSync(app.locals.deps.files.incoming)).toEqual([]);
  });

  it("at most 10 drawings per order; removal before release; no changes once released", async () => {
    const { user, agent, csrf } = await customer();
    const order = await buildOrder(app, user);
    let req = agent.post(`/api/orders/${order.id}/files`).set("X-CSRF-Token", csrf);
    for (let i = 0; i < 10; i++) req = req.attach("file", files.pdf, `sheet-${i}.pdf`);
    const res = await req;
    expect(res.status).toBe(201);
    const more = await agent.post(`/api/orders/${order.id}/files`).set("X-CSRF-Token", csrf).attach("file", files.pdf, "sheet-11.pdf");
    expect(more.status).toBe(400);
    expect(more.body.error.fields.file).toMatch(/at most 10/);
    const first = res.body.files[0];
    const stored = await StoredFile.findByPk(first.id);
    const onDisk = path.join(app.locals.deps.files.root, stored!.storageKey);
    const stranger = await customer();
    expect((await stranger.agent.delete(first.url).set("X-CSRF-Token", stranger.csrf)).status).toBe(404);
    expect((await agent.delete(first.url).set("X-CSRF-Token", csrf)).status).toBe(204);
    expect((await agent.get(first.url)).status).toBe(404);
    expect(existsSync(onDisk)).toBe(false);
    await Order.update({ status: "released" }, { where: { id: order.id } });
    const late = await agent.post(`/api/orders/${order.id}/files`).set("X-CSRF-Token", csrf).attach("file", files.pdf, "late.pdf");
    expect(late.status).toBe(409);
    expect((await agent.delete(res.body.files[1].url).set("X-CSRF-Token", csrf)).status).toBe(409);
  });
});
