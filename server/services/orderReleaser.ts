import { QueryTypes, type Transaction } from "sequelize";
import { documentNumber } from "../../shared/schemas/documents";
import { priceListSchema } from "../../shared/schemas/pricing";
import { forFabrication } from "../../shared/schemas/quote";
import { lotNumber } from "../../shared/shop-floor/codes";
import { dueDate } from "../../shared/shop-floor/due-dates";
import { flatPatternOf } from "../../shared/shop-floor/flat-pattern";
import { planRelease, ReleasePlanError } from "../../shared/shop-floor/release-plan";
import { ConflictError } from "../errors";
import type { Mailer } from "../jobs/mailer";
import { Job, Lot, PriceListVersion, ShopSettings, User, recordEvent, type Order, type Quote } from "../models";
import { orderStatusAllows } from "../policies/order";
import type { Actor } from "../policies/utils";
import { orderReleasedMail } from "./mail-texts";
import { materialCatalog } from "./materialCatalog";
import { designParts } from "./priceEstimator";

const round = (x: number, digits = 4) => +x.toFixed(digits);

/**
 * The lots and jobs of an order (locked by the caller): the design's parts, sized with the price
 * list the quote was priced with, become jobs with their routings and flat patterns, grouped into
 * lots of one alloy that fit the largest furnace. Lot numbers and job codes come from their
 * sequences; due dates from the requested date (else payment + the quoted lead time).
 */
export async function lotPlanner(props: { order: Order; quote: Quote; transaction: Transaction; now: Date }): Promise<{ lots: Lot[]; jobs: Job[]; dueDate: string }> {
  const { order, quote, transaction, now } = props;
  const [version, settings, catalog] = await Promise.all([
    PriceListVersion.findByPk(quote.priceListId, { attributes: ["data"], transaction }),
    ShopSettings.current(transaction),
    materialCatalog(),
  ]);
  const design = forFabrication(quote.configuration);
  const parts = designParts(design, priceListSchema.parse(version!.data));
  let plan;
  try {
    plan = planRelease({
      parts,
      quantity: order.quantity,
      annealed: (id) => (catalog.byId.get(id)?.relativePermeability.maximum ?? 1) > 1.5,
      maxLoad_kg: Math.max(0, ...settings.furnaces.map((f) => f.maxLoad_kg)),
    });
  } catch (err) {
    if (err instanceof ReleasePlanError) throw ConflictError(err.code, err.message);
    throw err;
  }

  const due = dueDate({ requestedDate: order.requestedDate, paidAt: order.paidAt, releasedAt: now, leadTime_workingDays: quote.leadTimeWorkingDays });
  const seqs = await order.sequelize.query<{ n: number }>(`select nextval('lot_number_seq')::int as n from generate_series(1, $1)`, { bind: [plan.length], type: QueryTypes.SELECT, transaction });
  const lots = await Lot.bulkCreate(
    plan.map((l, i) => ({
      seq: seqs[i].n, number: lotNumber(seqs[i].n, now), orderId: order.id, materialId: l.materialId, pieces: l.pieces,
      massKg: round(l.mass_kg), dueDate: due, createdAt: now, updatedAt: now,
    })),
    { transaction, returning: true },
  );

  // Pieces first (in the plan's order, so job codes follow layers), then the end caps and collars
  // that point at the piece they are welded to.
  const rows = plan.flatMap((l, li) =>
    l.jobs.map((j, ji) => {
      const p = parts[j.part];
      const annealIndex = j.routing.findIndex((s) => s.key === "anneal");
      return {
        lot: li,
        index: ji,
        assembly: j.assembly,
        values: {
          orderId: order.id, lotId: lots[li].id, assemblyJobId: null as string | null, layer: p.layer, role: p.role, method: p.method, materialId: p.materialId!,
          thicknessMm: p.thickness_mm, quantity: j.quantity, finishedPiece: p.finishedPiece, blank: p.blank, flatPattern: flatPatternOf(design, p),
          areaMm2: round(p.area_mm2, 2), massKg: p.mass_kg === undefined ? null : round(p.mass_kg, 5), drawStages: p.drawStages, processAnneals: p.processAnneals,
          weldLengthMm: round(p.weldLength_mm, 2), routing: j.routing, currentStep: j.routing[0].key, annealIndex: annealIndex < 0 ? null : annealIndex,
          dueDate: due, createdAt: now, updatedAt: now,
        },
      };
    }),
  );
  const pieceRows = rows.filter((r) => r.assembly === null);
  const pieces = await Job.bulkCreate(pieceRows.map((r) => r.values), { transaction, returning: true });
  const pieceOf = new Map(pieceRows.map((r, i) => [`${r.lot}:${r.index}`, pieces[i]]));
  const components = rows.filter((r) => r.assembly !== null).map((r) => ({ ...r.values, assemblyJobId: pieceOf.get(`${r.lot}:${r.assembly}`)!.id }));
  const welded = components.length ? await Job.bulkCreate(components, { transaction, returning: true }) : [];
  return { lots, jobs: [...pieces, ...welded], dueDate: due };
}

/**
 * Releases a paid order (locked by the caller) to the shop floor: its lots and jobs (lotPlanner),
 * the order "released", the event and the "released" mail with it.
 */
export async function orderReleaser(props: { actor: Actor; order: Order; quote: Quote; mailer: Mailer; appUrl: string; ip: string | null; transaction: Transaction; now?: Date }): Promise<Lot[]> {
  const { actor, order, quote, transaction } = props;
  const now = props.now ?? new Date();
  if (order.status === "released" || order.status === "shipped") throw ConflictError("ORDER_ALREADY_RELEASED", `Order ${documentNumber("order", order.number)} has already been released to the shop floor.`);
  if (!orderStatusAllows.release(order)) throw ConflictError("ORDER_NOT_RELEASABLE", `Only a paid order can be released; order ${documentNumber("order", order.number)} is ${order.status.replace("_", " ")}.`);
  const { lots, jobs, dueDate: due } = await lotPlanner({ order, quote, transaction, now });

  order.status = "released";
  await order.save({ transaction });
  const lotNumbers = lots.map((l) => l.number);
  await recordEvent(
    { actor, organizationId: order.organizationId, action: "order.released", subject: { type: "order", id: order.id }, data: { lots: lotNumbers, jobs: jobs.length, dueDate: due }, ip: props.ip, at: now },
    transaction,
  );
  const buyer = order.createdById ? await User.findByPk(order.createdById, { transaction }) : null;
  if (buyer) {
    await props.mailer.enqueue(
      orderReleasedMail({ to: buyer.email, name: buyer.name, orderNumber: documentNumber("order", order.number), link: `${props.appUrl}/orders/${order.id}`, lots: lotNumbers }),
      transaction,
    );
  }
  return lots;
}
