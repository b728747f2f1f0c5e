import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";
import { Event, Lot, Order } from "../../server/models";
import { buildTestApp, inbox } from "../support/app";
import { buildPaidOrder, ensureReferenceData } from "../support/ordering";
import { arrangeFinished, buildReleasedOrder, customer, designs, staff, type Agent } from "../support/shop-floor";

const app = buildTestApp();
beforeAll(ensureReferenceData);

const ship = (who: Agent, orderId: string, body: Record<string, unknown>) => who.agent.post(`/api/orders/${orderId}/shipments`).set("X-CSRF-Token", who.csrf).send(body);
const parcel = { carrier: "Harrow Freight (demo)", trackingNumber: "HF-20931-77" };

describe("POST /api/orders/:id/shipments", { timeout: 30_000 }, () => {
  it("401, 403 for the customer and an operator, 404 for another customer, 400 naming the fields; 409 before every job is packed and for an order not released", async () => {
    const { order, buyer, jobs } = await buildReleasedOrder(app);
    expect((await request(app).post(`/api/orders/${order.id}/shipments`).send(parcel)).status).toBe(401);
    const own = await customer(app, buyer.organizationId);
    expect((await ship(own, order.id, parcel)).status).toBe(403);
    expect((await ship(await staff(app, "operator"), order.id, parcel)).status).toBe(403);
    expect((await ship(await customer(app), order.id, parcel)).status).toBe(404);
    const planner = await staff(app, "admin");
    let res = await ship(planner, order.id, { carrier: "", lotIds: ["x"] });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(["carrier", "lotIds.0", "trackingNumber"]);
    res = await ship(planner, order.id, parcel);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: "NOT_PACKED", message: expect.stringContaining(`job ${jobs[0].code} is at material`) });
    const paid = await buildPaidOrder(app, buyer);
    res = await ship(planner, paid.id, parcel);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("ORDER_NOT_SHIPPABLE");
    expect((await Order.findByPk(order.id))!.status).toBe("released");
  });

  it("201 after pack: the shipment on the order with carrier, tracking number and parts, the order shipped, the 'shipped' mail; nothing left to ship is a 409", async () => {
    const { order, lots, buyer } = await buildReleasedOrder(app);
    await arrangeFinished(lots[0].id);
    const planner = await staff(app, "admin");
    const res = await ship(planner, order.id, parcel);
    expect(res.status).toBe(201);
    expect(res.body.status).toBe("shipped");
    expect(res.body.shipments).toEqual([
      { id: expect.any(String), ...parcel, shippedAt: expect.any(String), parts: [{ lotId: lots[0].id, lotNumber: lots[0].number, pieces: 4 }], createdBy: { id: planner.user.id, name: "admin person" } },
    ]);
    expect(res.body.timeline.at(-1)).toMatchObject({ action: "order.shipped", label: "Shipped", detail: `${parcel.carrier}, tracking ${parcel.trackingNumber} (lot ${lots[0].number})` });
    expect(res.body.abilities.ship).toBe(false);
    const mail = (await inbox(app, buyer.email)).find((m) => m.subject === `Order ${res.body.number} has shipped`);
    expect(mail?.text).toContain(parcel.trackingNumber);
    expect(mail?.text).toContain(parcel.carrier);
    const lot = await planner.agent.get(`/api/lots/${lots[0].id}`);
    expect(lot.body).toMatchObject({ status: "shipped", shipment: { carrier: parcel.carrier, trackingNumber: parcel.trackingNumber } });
    expect((await planner.agent.get(`/api/jobs/${(await lot.body).jobs[0].id}`)).body.status).toBe("shipped");
    expect((await ship(planner, order.id, parcel)).status).toBe(409);
  });

  it("lots ship in parcels of their own: the order ships with the last; a held lot does not ship", async () => {
    const { order, lots } = await buildReleasedOrder(app, { configuration: designs.bentTwoAlloys(), quantity: 1 });
    for (const l of lots) await arrangeFinished(l.id);
    const planner = await staff(app, "admin");
    await Lot.update({ holdReason: "Awaiting the customer's deviation approval", heldAt: new Date() }, { where: { id: lots[1].id } });
    let res = await ship(planner, order.id, { ...parcel, lotIds: [lots[1].id] });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("LOT_ON_HOLD");
    res = await ship(planner, order.id, { ...parcel, lotIds: [lots[0].id] });
    expect(res.status).toBe(201);
    expect(res.body.status).toBe("released");
    expect(res.body.timeline.at(-1)).toMatchObject({ action: "order.part-shipped", label: "Part of the order shipped" });
    await Lot.update({ holdReason: null, heldAt: null }, { where: { id: lots[1].id } });
    expect((await ship(planner, order.id, { ...parcel, lotIds: [lots[0].id] })).status).toBe(409);
    res = await ship(planner, order.id, { carrier: "Harrow Freight (demo)", trackingNumber: "HF-20931-78" });
    expect(res.status).toBe(201);
    expect(res.body.status).toBe("shipped");
    expect(res.body.shipments).toHaveLength(2);
    expect(await Event.count({ where: { subjectId: order.id, action: ["order.shipped", "order.part-shipped"] } })).toBe(2);
  });
});
