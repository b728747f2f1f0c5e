import type { ReactNode } from "react";
import { Link, useNavigate } from "react-router-dom";
import { useQuery } from "@tanstack/react-query";
import { designSummary } from "../../../shared/schemas/design";
import type { QuoteBlankPart } from "../../../shared/schemas/quote";
import { ApiError } from "../../api/client";
import { quotePdfUrl, quoteQueryOptions, useRequote, type QuoteJson } from "../../api/quotes";
import { PriceBreakdown } from "../../components/pricing/price-breakdown";
import { QueryError } from "../../components/query-error";
import { Button, ButtonLink, buttonClass } from "../../components/ui/button";
import { Panel } from "../../components/ui/panel";
import { ResponsiveTable } from "../../components/ui/responsive-table";
import { Loading } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { paths } from "../../config/paths";
import { formatDate, formatDateTime } from "../../lib/format";
import { formatMoney } from "../../lib/money";
import { QuoteStatusChip } from "./status-chip";

const mm = (x: number) => `${+x.toPrecision(5)} mm`;

function blankText(b: QuoteBlankPart["blank"]): string {
  return b.kind === "disc" ? `disc Ø ${mm(b.diameter_mm)}` : `${b.kind} ${+b.length_mm.toPrecision(5)} × ${mm(b.width_mm)}`;
}

/** Draws the quoted design (the page passes the design check's cross-section). */
type DrawingOf = (configuration: QuoteJson["configuration"]) => ReactNode;

/** One quote: what is priced, the frozen prediction and blanks, every price line, validity; PDF, order or re-quote. */
export function QuoteDetail({ id, drawing }: { id: string; drawing?: DrawingOf }) {
  const quote = useQuery(quoteQueryOptions(id));
  if (quote.isPending) return <Loading label="Loading the quote…" />;
  if (quote.isError) return <QueryError error={quote.error} onRetry={() => void quote.refetch()} what="the quote" />;
  return <QuoteView q={quote.data} drawing={drawing} />;
}

function QuoteView({ q, drawing }: { q: QuoteJson; drawing?: DrawingOf }) {
  const requote = useRequote();
  const navigate = useNavigate();
  const c = q.configuration;
  const p = q.prediction;
  const need = c.requiredAttenuation_db;
  const meets = p.band.low_db >= need;
  const money = (cents: number) => formatMoney(cents, q.currency);

  return (
    <div className="space-y-6">
      <Panel>
        <div className="flex flex-wrap items-start justify-between gap-4">
          <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-4 gap-y-1">
            <dt className="font-semibold text-flux-700">Status</dt>
            <dd>
              <QuoteStatusChip status={q.status} />
            </dd>
            <dt className="font-semibold text-flux-700">For</dt>
            <dd>{q.organization.name}</dd>
            <dt className="font-semibold text-flux-700">Made</dt>
            <dd className="font-mono">{formatDateTime(q.createdAt)}{q.createdBy ? ` · ${q.createdBy.name}` : ""}</dd>
            <dt className="font-semibold text-flux-700">Valid until</dt>
            <dd className="font-mono" data-testid="quote-valid-until">{formatDate(q.expiresAt)}</dd>
            <dt className="font-semibold text-flux-700">Quantity</dt>
            <dd className="font-mono">{q.quantity}</dd>
            <dt className="font-semibold text-flux-700">Total</dt>
            <dd className="font-mono font-semibold" data-testid="quote-total">{money(q.total_cents)} <span className="font-normal text-flux-600">({money(q.unitPrice_cents)} a piece)</span></dd>
            <dt className="font-semibold text-flux-700">Lead time</dt>
            <dd>{q.leadTime_workingDays} working days from payment</dd>
          </dl>
          <div className="flex flex-wrap gap-2">
            {q.abilities.download && (
              <a className={buttonClass("secondary")} href={quotePdfUrl(q.id)} download>
                Download the quote (PDF)
              </a>
            )}
            {q.abilities.order && (
              <ButtonLink variant="primary" to={paths.orderNew.href(q.id)}>
                Order this quote
              </ButtonLink>
            )}
            {q.orderId && <ButtonLink to={paths.order.href(q.orderId)}>See the order</ButtonLink>}
          </div>
        </div>
        {q.status === "expired" && (
          <StatusNote tone="caution" word="Expired" className="mt-4">
            <p>This quote expired on {formatDate(q.expiresAt)}: its prices no longer hold and it cannot be ordered. A new quote prices the same design and quantity at today's rates.</p>
            {q.abilities.requote && (
              <Button
                className="mt-2"
                pending={requote.isPending}
                pendingLabel="Quoting…"
                onClick={() => requote.mutate(q.id, { onSuccess: (fresh) => navigate(paths.quote.href(fresh.id)) })}
              >
                Re-quote at today's rates
              </Button>
            )}
            {requote.isError && <p role="alert" className="mt-2 font-semibold text-danger-700">{requote.error instanceof ApiError ? requote.error.message : "The new quote could not be made. Try again."}</p>}
          </StatusNote>
        )}
        {q.requotedFromId && (
          <p className="mt-3 text-meta text-flux-600">
            A new quote for{" "}
            <Link className="underline underline-offset-4" to={paths.quote.href(q.requotedFromId)}>
              an earlier one
            </Link>{" "}
            that had expired.
          </p>
        )}
      </Panel>

      <div className="grid grid-cols-1 items-start gap-6 lg:grid-cols-2">
        <Panel title="The design quoted">
          <p className="mb-3 font-semibold text-flux-900" data-testid="quote-design">{designSummary(c)}</p>
          <ol className="space-y-1" aria-label="Layers, innermost first">
            {c.layers.map((l, i) => (
              <li key={i}>
                Layer {i + 1}: {l.material ?? `μr ${l.mu_r} (made in ${l.pricedAs})`}, {mm(l.thickness_mm)} wall{l.gap_mm !== undefined && i < c.layers.length - 1 ? `, ${mm(l.gap_mm)} gap outside` : ""}
              </li>
            ))}
          </ol>
          <p className="mt-3 text-flux-700">
            Field {c.field.amplitude_uT} µT at {c.field.frequency_hz} Hz, {c.field.orientation}; {c.state}.{c.holes?.length ? ` ${c.holes.length} cable hole${c.holes.length === 1 ? "" : "s"}.` : ""}
            {q.mass_kg !== null ? ` Mass about ${q.mass_kg.toFixed(3)} kg per shield.` : ""}
          </p>
          {drawing && <div className="mt-4">{drawing(c)}</div>}
          {q.designId && (
            <p className="mt-2 text-meta text-flux-600">
              From a saved design. <Link className="underline underline-offset-4" to={paths.designs.href()}>Your designs</Link>
            </p>
          )}
        </Panel>
        <Panel title="Predicted attenuation, as quoted">
          <p className="font-display text-h3 font-semibold" data-testid="quote-db">
            {p.beyondLimit ? `over ${p.attenuation_db.toFixed(0)}` : p.attenuation_db.toFixed(1)} dB
          </p>
          <p className="text-flux-700">
            as built, likely {p.band.low_db.toFixed(0)}–{p.band.high_db.toFixed(0)} dB; the seamless shell {p.ideal.beyondLimit ? "over 300" : p.ideal.attenuation_db.toFixed(1)} dB.
          </p>
          <StatusNote tone={meets ? "ok" : "caution"} word={meets ? "Meets the need" : "Short of the need"} className="mt-3">
            {meets ? `You need ${need} dB: even the low end of the likely range reaches it.` : `You need ${need} dB: the low end of the likely range falls ${(need - p.band.low_db).toFixed(1)} dB short. Talk to the shop before ordering.`}
          </StatusNote>
          {p.warnings.length > 0 && (
            <ul className="mt-3 list-disc space-y-1 pl-5 text-meta text-caution-900">
              {p.warnings.map((w, i) => (
                <li key={i}>{w.message}</li>
              ))}
            </ul>
          )}
          <p className="mt-3 text-meta text-flux-600">Predictions are engineering estimates, not a guarantee; the values measured on each lot's certificate of conformance rule. Safety-critical uses need your own qualified review.</p>
        </Panel>
      </div>

      <Panel title="Blanks">
        <ResponsiveTable<QuoteBlankPart>
          caption="Blanks of one shield"
          rows={q.blank.parts}
          rowKey={(b) => `${b.layer}-${b.role}-${blankText(b.blank)}`}
          cardsBelow={640}
          columns={[
            { key: "part", header: "Part", primary: true, cell: (b) => `Layer ${b.layer + 1} · ${b.role}` },
            { key: "method", header: "Made", cell: (b) => b.method },
            { key: "blank", header: "Blank", className: "font-mono", cell: (b) => `${blankText(b.blank)}, ${mm(b.thickness_mm)}` },
            { key: "each", header: "Per shield", align: "end", className: "font-mono", cell: (b) => b.quantityPerAssembly },
            { key: "mass", header: "Mass each", align: "end", className: "font-mono whitespace-nowrap", cell: (b) => (b.mass_kg === undefined ? "—" : `${b.mass_kg.toFixed(3)} kg`) },
          ]}
        />
      </Panel>

      <Panel title="Price">
        <PriceBreakdown estimate={{ price: q.price, currency: q.currency, priceListVersion: q.priceListVersion }} fixed />
      </Panel>
    </div>
  );
}
