import type { PriceEstimate } from "../../api/fabrication";
import { formatMoney } from "../../lib/money";
import { NestingSvg } from "../drawing/nesting-svg";
import { StatusNote } from "../ui/status-note";
import { ScrollX } from "../ui/scroll-x";

const qty = (x: number) => (Number.isInteger(x) ? String(x) : x.toFixed(3));

/**
 * A price estimate as the customer reads it: every line of the build-up in the list's currency
 * (integer cents on the wire), the price per piece and the total, then the nesting on the sheet.
 * Used by the flat-blank page (one blank) and the design check (the whole nested design).
 */
export function PriceBreakdown({ estimate: data, dimmed }: { estimate: PriceEstimate; dimmed?: boolean }) {
  const money = (c: number) => formatMoney(c, data.currency);
  return (
    <div className={`space-y-6 ${dimmed ? "stale" : ""}`}>
      <ScrollX label="the price build-up table">
        <table className="w-full min-w-[22rem] text-left text-body" data-testid="price-table">
          <caption className="sr-only">Price build-up for {data.price.quantity} pieces</caption>
          <thead className="border-b border-nickel-300 text-meta text-flux-600">
            <tr>
              <th className="py-1 pr-3 font-semibold">Line</th>
              <th className="py-1 pr-3 text-right font-semibold">Quantity</th>
              <th className="py-1 pr-3 text-right font-semibold">Unit</th>
              <th className="py-1 text-right font-semibold">Amount</th>
            </tr>
          </thead>
          <tbody>
            {data.price.lines.map((l) => (
              <tr key={l.key} className="border-b border-nickel-100">
                <td className="py-1 pr-3">{l.label}</td>
                <td className="py-1 pr-3 text-right font-mono">{qty(l.quantity)}</td>
                <td className="py-1 pr-3 text-right font-mono">{money(l.unit_cents)}</td>
                <td className="py-1 text-right font-mono">{money(l.total_cents)}</td>
              </tr>
            ))}
          </tbody>
          <tfoot className="font-mono">
            <tr className="border-t-2 border-nickel-300">
              <th scope="row" colSpan={3} className="py-1 pr-3 text-right font-sans font-semibold">Subtotal</th>
              <td className="py-1 text-right">{money(data.price.subtotal_cents)}</td>
            </tr>
            <tr>
              <th scope="row" colSpan={3} className="py-1 pr-3 text-right font-sans font-normal">Margin {data.price.marginPercent} %</th>
              <td className="py-1 text-right">{money(data.price.margin_cents)}</td>
            </tr>
            <tr>
              <th scope="row" colSpan={3} className="py-1 pr-3 text-right font-sans font-normal">Quantity discount {data.price.discountPercent} %</th>
              <td className="py-1 text-right">−{money(data.price.discount_cents)}</td>
            </tr>
            <tr>
              <th scope="row" colSpan={3} className="py-1 pr-3 text-right font-sans font-normal">Rounding to whole cents per piece</th>
              <td className="py-1 text-right">{money(data.price.rounding_cents)}</td>
            </tr>
            <tr>
              <th scope="row" colSpan={3} className="py-1 pr-3 text-right font-sans font-semibold">Price per piece</th>
              <td className="py-1 text-right font-semibold" data-testid="unit-price">{money(data.price.unitPrice_cents)}</td>
            </tr>
            <tr className="text-lead">
              <th scope="row" colSpan={3} className="py-1 pr-3 text-right font-sans font-semibold">Total for {data.price.quantity}</th>
              <td className="py-1 text-right font-semibold" data-testid="total-price">{money(data.price.total_cents)}</td>
            </tr>
          </tfoot>
        </table>
      </ScrollX>
      <p className="text-meta text-flux-600">
        Prices in {data.currency}, an estimate from price list version {data.priceListVersion}; a quote fixes the price. Setup is spread over the quantity: {money(data.price.setupPerUnit_cents)} a piece.
      </p>
      {data.nesting.map((g) => (
        <div key={`${g.materialId}@${g.thickness_mm}`} className="space-y-2">
          <h3 className="text-h4">Nesting on the stock sheet{data.nesting.length > 1 ? ` · ${g.materialId} ${g.thickness_mm} mm` : ""}</h3>
          {g.sheet ? <NestingSvg group={g} /> : <StatusNote tone="info">No stock sheet of {g.materialId} {g.thickness_mm} mm is listed; material is priced at the planner's assumed utilisation of {(g.utilisation * 100).toFixed(0)} %.</StatusNote>}
        </div>
      ))}
    </div>
  );
}
