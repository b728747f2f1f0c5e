import { Router } from "express";
import { Op, literal, type Transaction, type WhereOptions } from "sequelize";
import { parseDocumentNumber } from "../../shared/schemas/documents";
import { quoteCreateSchema, quoteListQuerySchema } from "../../shared/schemas/quote";
import { quoteDocument } from "../documents";
import type { AppDeps } from "../deps";
import { NotFoundError, ValidationError } from "../errors";
import { containsPattern, parseInput, recordId } from "../middleware/validate";
import { requireUser } from "../middleware/security";
import { Design, Organization, Quote, User } from "../models";
import { designPolicy } from "../policies/design";
import { quotePolicy } from "../policies/quote";
import { authorize, isStaff, requireRole } from "../policies/utils";
import { presentQuote, presentQuoteSummary } from "../presenters/quote";
import { quoteBuilder } from "../services/quoteBuilder";

const include = [
  { model: Organization, as: "organization" },
  { model: User, as: "createdBy" },
];
const ORDER_OF_QUOTE = `(select o.id from orders o where o.quote_id = "Quote"."id")`;
const sortColumns = { createdAt: "createdAt", number: "number", total: "totalCents", expiresAt: "expiresAt" } as const;

/** Loads a quote with its organisation, author and order id; 404 when there is none. */
export async function loadQuote(id: unknown, transaction?: Transaction): Promise<Quote> {
  const quote = await Quote.findByPk(recordId(id, "quote"), {
    include,
    attributes: { include: [[literal(ORDER_OF_QUOTE), "orderId"]] },
    transaction,
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: Quote } : undefined,
  });
  if (!quote) throw NotFoundError("quote");
  quote.orderId = (quote.getDataValue("orderId" as never) as string | null) ?? null;
  return quote;
}

/** A new quote's organisation and author for its answer (the signed-in user comes with its organisation). */
async function withRelations(quote: Quote, actor: User, transaction?: Transaction): Promise<Quote> {
  quote.organization = actor.organization?.id === quote.organizationId ? actor.organization : ((await Organization.findByPk(quote.organizationId, { transaction })) ?? undefined);
  quote.createdBy = actor;
  quote.orderId = null;
  return quote;
}

/** Quotes: priced and frozen configurations, their PDF, and a new quote at today's rates. */
export function quotesRouter({ sequelize }: AppDeps): Router {
  const router = Router();

  router.post("/quotes", requireUser, async (req, res) => {
    const actor = req.user!;
    requireRole(actor, "customer");
    const input = parseInput(quoteCreateSchema, req.body);
    if (input.designId) {
      const design = await Design.findByPk(input.designId);
      // another organisation's design is as unknown as a missing one
      if (!design || !designPolicy.see(actor, design)) throw ValidationError({ designId: "no such saved design" });
    }
    // one statement writes the quote and its event (see quoteBuilder): no transaction to open here
    const quote = await quoteBuilder({ actor, organizationId: actor.organizationId, configuration: input.configuration, quantity: input.quantity, designId: input.designId ?? null, ip: req.ip ?? null });
    res.status(201).json(presentQuote(await withRelations(quote, actor), actor));
  });

  router.get("/quotes", requireUser, async (req, res) => {
    const actor = req.user!;
    const query = parseInput(quoteListQuerySchema, req.query);
    const conditions: WhereOptions[] = [];
    if (!isStaff(actor)) conditions.push({ organizationId: actor.organizationId });
    if (query.status === "ordered") conditions.push(literal(`exists (select 1 from orders o where o.quote_id = "Quote"."id")`));
    if (query.status === "open" || query.status === "expired") {
      conditions.push(literal(`not exists (select 1 from orders o where o.quote_id = "Quote"."id")`));
      conditions.push({ expiresAt: { [query.status === "open" ? Op.gt : Op.lte]: new Date() } });
    }
    if (query.q) {
      const ref = parseDocumentNumber(query.q);
      const text = containsPattern(query.q);
      conditions.push({
        [Op.or]: [
          ...(ref && (ref.kind === null || ref.kind === "quote") ? [{ number: ref.n }] : []),
          ...(isStaff(actor) ? [{ "$organization.name$": { [Op.iLike]: text } }] : []),
          literal(`exists (select 1 from designs d where d.id = "Quote"."design_id" and d.name ilike ${sequelize.escape(text)})`),
        ],
      });
    }
    const { rows, count } = await Quote.findAndCountAll({
      where: { [Op.and]: conditions },
      include: [{ model: Organization, as: "organization" }],
      // the list shows the headline figure only: read it without shipping every frozen answer
      attributes: { include: [[literal(ORDER_OF_QUOTE), "orderId"], [literal(`("Quote"."prediction"->>'attenuation_db')::float8`), "attenuationDb"]], exclude: ["prediction", "blank", "price"] },
      order: [[sortColumns[query.sort], query.dir.toUpperCase()], ["number", "DESC"]],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    });
    const items = rows.map((q) => {
      q.orderId = (q.getDataValue("orderId" as never) as string | null) ?? null;
      q.prediction = { attenuation_db: q.getDataValue("attenuationDb" as never) as number } as Quote["prediction"];
      return presentQuoteSummary(q);
    });
    res.json({ items, total: count, page: query.page, pageSize: query.pageSize });
  });

  router.get("/quotes/:id", requireUser, async (req, res) => {
    const quote = await loadQuote(req.params.id);
    authorize(req.user!, "read", quotePolicy, quote);
    res.json(presentQuote(quote, req.user!));
  });

  // The quote as a PDF (A4 or US Letter by the organisation's setting); never the shop's rates or margin.
  router.get("/quotes/:id/quote.pdf", requireUser, async (req, res) => {
    const quote = await loadQuote(req.params.id);
    authorize(req.user!, "read", quotePolicy, quote);
    const { filename, content } = await quoteDocument(quote);
    res.attachment(filename).type("application/pdf").set("Cache-Control", "private, no-store").send(content);
  });

  // A new quote of the same configuration and quantity at today's rates (an expired quote's way on).
  router.post("/quotes/:id/requote", requireUser, async (req, res) => {
    const actor = req.user!;
    const quote = await sequelize.transaction(async (transaction) => {
      const old = await loadQuote(req.params.id, transaction);
      authorize(actor, "requote", quotePolicy, old);
      const design = old.designId ? await Design.findByPk(old.designId, { transaction }) : null;
      const quote = await quoteBuilder({
        actor, organizationId: old.organizationId, configuration: old.configuration, quantity: old.quantity,
        designId: design ? design.id : null, requotedFromId: old.id, ip: req.ip ?? null, transaction,
      });
      return withRelations(quote, actor, transaction);
    });
    res.status(201).json(presentQuote(quote, actor));
  });

  return router;
}
