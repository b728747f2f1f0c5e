import { Router, type Request, type Response } from "express";
import { Op, type Transaction, type WhereOptions } from "sequelize";
import { parseDocumentNumber } from "../../shared/schemas/documents";
import {
  MAX_DRAWINGS_PER_ORDER, MAX_DRAWING_BYTES, orderCreateSchema, orderListQuerySchema, orderUpdateSchema, refundCreateSchema, shipmentCreateSchema, type CheckoutJson,
} from "../../shared/schemas/order";
import { invoiceDocument } from "../documents";
import type { AppDeps } from "../deps";
import { NotFoundError } from "../errors";
import { discardUploads, receiveUploads } from "../files/upload";
import { containsPattern, parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { Event, Invoice, Job, Lot, Order, OrderFile, Organization, Payment, Quote, Shipment, StoredFile, User, WebhookEvent } from "../models";
import { orderPolicy } from "../policies/order";
import { quotePolicy } from "../policies/quote";
import { authorize, isStaff, type Actor } from "../policies/utils";
import { presentOrder, presentOrderFile, presentOrderSummary } from "../presenters/order";
import { checkoutStarter } from "../services/checkoutStarter";
import { drawingRemover, drawingUploader } from "../services/drawingUploader";
import { orderCanceller } from "../services/orderCanceller";
import { orderPlacer } from "../services/orderPlacer";
import { orderUpdater } from "../services/orderUpdater";
import { orderReleaser } from "../services/orderReleaser";
import { refundIssuer } from "../services/refundIssuer";
import { shipmentRecorder } from "../services/shipmentRecorder";
import { loadQuote } from "./quotes";

const sortColumns = { createdAt: "createdAt", number: "number", total: "totalCents", status: "status", requestedDate: "requestedDate" } as const;

/** The order row (locked when a transaction is given) with its organisation and quote. */
async function loadOrder(id: unknown, transaction?: Transaction): Promise<Order> {
  const order = await Order.findByPk(recordId(id, "order"), { transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!order) throw NotFoundError("order");
  const [organization, quote] = await Promise.all([
    Organization.findByPk(order.organizationId, { transaction }),
    Quote.findByPk(order.quoteId, { transaction }),
  ]);
  order.organization = organization ?? undefined;
  order.quote = quote ?? undefined;
  return order;
}

/** Everything the order page shows: payments, drawings, the event trail, the invoice, the people named. */
async function detailParts(order: Order, transaction?: Transaction) {
  const [payments, files, events, invoice, issues, lots, jobs, shipments] = await Promise.all([
    Payment.findAll({ where: { orderId: order.id }, order: [["createdAt", "ASC"], ["id", "ASC"]], transaction }),
    OrderFile.findAll({ where: { orderId: order.id }, include: [{ model: StoredFile, as: "file" }], order: [["createdAt", "ASC"]], transaction }),
    Event.findAll({ where: { subjectType: "order", subjectId: order.id }, order: [["createdAt", "ASC"], ["id", "ASC"]], transaction }),
    Invoice.findOne({ where: { orderId: order.id }, transaction }),
    WebhookEvent.findAll({ where: { orderId: order.id, outcome: ["amount_mismatch", "order_not_payable"] }, order: [["receivedAt", "ASC"]], transaction }),
    Lot.findAll({ where: { orderId: order.id }, order: [["seq", "ASC"]], transaction }),
    Job.findAll({ where: { orderId: order.id }, attributes: ["id", "code", "lotId"], order: [["seq", "ASC"]], transaction }),
    Shipment.findAll({ where: { orderId: order.id }, order: [["shippedAt", "ASC"]], transaction }),
  ]);
  const ids = new Set<string>();
  for (const e of events) if (e.actorId) ids.add(e.actorId);
  for (const f of files) if (f.file?.uploadedById) ids.add(f.file.uploadedById);
  if (order.createdById) ids.add(order.createdById);
  for (const s of shipments) if (s.createdById) ids.add(s.createdById);
  const people = new Map((await User.findAll({ where: { id: [...ids] }, attributes: ["id", "name"], transaction })).map((u) => [u.id, u]));
  const lotParts = lots.map((lot) => ({ lot, jobs: jobs.filter((j) => j.lotId === lot.id).map((j) => ({ id: j.id, code: j.code })) }));
  return { payments, files, events, invoice, issues, people, lots: lotParts, shipments };
}

async function respondWithOrder(res: Response, order: Order, actor: Actor, status = 200) {
  res.status(status).json(presentOrder(order, await detailParts(order), actor));
}

/** Orders, their checkout, drawings, refunds and invoice. */
export function ordersRouter(deps: AppDeps): Router {
  const { sequelize, mailer, config, stripe, files: store } = deps;
  const router = Router();
  const ip = (req: Request) => req.ip ?? null;

  // Multipart drawings land in the store's incoming folder under random names while they are checked.
  const receiveFiles = (req: Request, res: Response) =>
    receiveUploads(req, res, { store, field: "file", maxBytes: MAX_DRAWING_BYTES, maxFiles: MAX_DRAWINGS_PER_ORDER, what: "a drawing" });

  router.post("/orders", requireUser, async (req, res) => {
    const actor = req.user!;
    const input = parseInput(orderCreateSchema, req.body);
    const order = await sequelize.transaction(async (transaction) => {
      const quote = await loadQuote(input.quoteId, transaction);
      authorize(actor, "order", quotePolicy, quote);
      return orderPlacer({ actor, quote, input, mailer, appUrl: config.appUrl, ip: ip(req), transaction });
    });
    await respondWithOrder(res, await loadOrder(order.id), actor, 201);
  });

  router.get("/orders", requireUser, async (req, res) => {
    const actor = req.user!;
    const query = parseInput(orderListQuerySchema, req.query);
    const conditions: WhereOptions[] = [];
    if (!isStaff(actor)) conditions.push({ organizationId: actor.organizationId });
    if (query.status) conditions.push({ status: query.status });
    if (query.q) {
      const ref = parseDocumentNumber(query.q);
      const text = containsPattern(query.q);
      conditions.push({
        [Op.or]: [
          ...(ref && ref.kind !== "quote" ? [{ number: ref.n }] : []),
          ...(ref && ref.kind !== "order" ? [{ "$quote.number$": ref.n }] : []),
          { purchaseOrder: { [Op.iLike]: text } },
          ...(isStaff(actor) ? [{ "$organization.name$": { [Op.iLike]: text } }] : []),
        ],
      });
    }
    const { rows, count } = await Order.findAndCountAll({
      where: { [Op.and]: conditions },
      include: [
        { model: Organization, as: "organization", attributes: ["id", "name"] },
        { model: Quote, as: "quote", attributes: ["id", "number", "configuration"] },
      ],
      order: [[sortColumns[query.sort], query.dir === "asc" ? "ASC NULLS FIRST" : "DESC NULLS LAST"], ["number", "DESC"]],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    });
    res.json({ items: rows.map(presentOrderSummary), total: count, page: query.page, pageSize: query.pageSize });
  });

  router.get("/orders/:id", requireUser, async (req, res) => {
    const order = await loadOrder(req.params.id);
    authorize(req.user!, "read", orderPolicy, order);
    await respondWithOrder(res, order, req.user!);
  });

  router.patch("/orders/:id", requireUser, async (req, res) => {
    const input = parseInput(orderUpdateSchema, req.body);
    const order = await sequelize.transaction(async (transaction) => {
      const order = await loadOrder(req.params.id, transaction);
      authorize(req.user!, "update", orderPolicy, order);
      return orderUpdater({ actor: req.user!, order, input, ip: ip(req), transaction });
    });
    await respondWithOrder(res, order, req.user!);
  });

  router.post("/orders/:id/cancel", requireUser, async (req, res) => {
    const order = await sequelize.transaction(async (transaction) => {
      const order = await loadOrder(req.params.id, transaction);
      authorize(req.user!, "cancel", orderPolicy, order);
      return orderCanceller({ actor: req.user!, order, stripe, ip: ip(req), transaction });
    });
    await respondWithOrder(res, order, req.user!);
  });

  // The hosted checkout: the order's row lock makes a double click wait and get the same session.
  router.post("/orders/:id/checkout", requireUser, async (req, res) => {
    const session = await sequelize.transaction(async (transaction) => {
      const order = await loadOrder(req.params.id, transaction);
      authorize(req.user!, "pay", orderPolicy, order);
      return checkoutStarter({ actor: req.user!, order, quote: order.quote!, stripe, appUrl: config.appUrl, ip: ip(req), transaction });
    });
    const body: CheckoutJson = { checkoutUrl: session.url, sessionId: session.id };
    res.json(body);
  });

  router.post("/orders/:id/refunds", requireUser, async (req, res) => {
    const input = parseInput(refundCreateSchema, req.body);
    const order = await sequelize.transaction(async (transaction) => {
      const order = await loadOrder(req.params.id, transaction);
      authorize(req.user!, "refund", orderPolicy, order);
      await refundIssuer({ actor: req.user!, order, input, stripe, mailer, appUrl: config.appUrl, ip: ip(req), transaction });
      return order;
    });
    await respondWithOrder(res, order, req.user!, 201);
  });

  // Release to the shop floor: jobs and lots from the design, the "released" mail.
  router.post("/orders/:id/release", requireUser, async (req, res) => {
    const order = await sequelize.transaction(async (transaction) => {
      const order = await loadOrder(req.params.id, transaction);
      authorize(req.user!, "release", orderPolicy, order);
      await orderReleaser({ actor: req.user!, order, quote: order.quote!, mailer, appUrl: config.appUrl, ip: ip(req), transaction });
      return order;
    });
    await respondWithOrder(res, order, req.user!);
  });

  // A parcel leaves the shop with packed lots; the last one ships the order.
  router.post("/orders/:id/shipments", requireUser, async (req, res) => {
    const input = parseInput(shipmentCreateSchema, req.body);
    const order = await sequelize.transaction(async (transaction) => {
      const order = await loadOrder(req.params.id, transaction);
      authorize(req.user!, "ship", orderPolicy, order);
      await shipmentRecorder({ actor: req.user!, order, input, sequelize, mailer, appUrl: config.appUrl, ip: ip(req), transaction });
      return order;
    });
    await respondWithOrder(res, order, req.user!, 201);
  });

  router.post("/orders/:id/files", requireUser, async (req, res) => {
    const actor = req.user!;
    // who may attach is settled before the body is read, so a stranger's upload is never stored
    const before = await loadOrder(req.params.id);
    authorize(actor, "upload", orderPolicy, before);
    const uploads = await receiveFiles(req, res);
    try {
      const stored = await sequelize.transaction(async (transaction) => {
        const order = await loadOrder(req.params.id, transaction);
        return drawingUploader({ actor, order, uploads, store, ip: ip(req), transaction });
      });
      const people = new Map([[actor.id, actor as User]]);
      res.status(201).json({ files: stored.map((file) => presentOrderFile(before.id, Object.assign(new OrderFile(), { file }), people)) });
    } finally {
      await discardUploads(uploads);
    }
  });

  async function loadFile(order: Order, fileId: unknown, transaction?: Transaction): Promise<StoredFile> {
    const id = recordId(fileId, "file");
    const link = await OrderFile.findOne({ where: { orderId: order.id, storedFileId: id }, include: [{ model: StoredFile, as: "file" }], transaction });
    if (!link?.file) throw NotFoundError("file");
    return link.file;
  }

  // Drawings go to the order's organisation and the shop's staff only, always as a download.
  router.get("/orders/:id/files/:fileId", requireUser, async (req, res) => {
    const order = await loadOrder(req.params.id);
    authorize(req.user!, "read", orderPolicy, order);
    const file = await loadFile(order, req.params.fileId);
    res.attachment(file.filename);
    res.type(file.contentType);
    res.set({ "Cache-Control": "private, no-store", "Content-Security-Policy": "default-src 'none'; sandbox" });
    res.sendFile(store.pathOf(file.storageKey), { dotfiles: "deny", headers: { "Content-Type": file.contentType } });
  });

  router.delete("/orders/:id/files/:fileId", requireUser, async (req, res) => {
    await sequelize.transaction(async (transaction) => {
      const order = await loadOrder(req.params.id, transaction);
      authorize(req.user!, "upload", orderPolicy, order);
      const file = await loadFile(order, req.params.fileId, transaction);
      await drawingRemover({ actor: req.user!, order, file, store, ip: ip(req), transaction });
    });
    res.status(204).end();
  });

  // Invoice and receipt: issued when the payment arrived, re-rendered with any refunds since.
  router.get("/orders/:id/invoice.pdf", requireUser, async (req, res) => {
    const order = await loadOrder(req.params.id);
    authorize(req.user!, "read", orderPolicy, order);
    const invoice = await Invoice.findOne({ where: { orderId: order.id } });
    if (!invoice) throw NotFoundError("invoice");
    const { filename, content } = await invoiceDocument(invoice);
    res.attachment(filename).type("application/pdf").set("Cache-Control", "private, no-store").send(content);
  });

  return router;
}
