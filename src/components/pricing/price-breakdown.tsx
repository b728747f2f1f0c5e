import type { PriceEstimate } from "../../api/fabrication";
import { formatMoney } from "../../lib/money";
import { NestingSvg } from "../drawing/nesting-svg";
import { ResponsiveTable, type Column, type FooterLine } from "../ui/responsive-table";
import { StatusNote } from "../ui/status-note";

const qty = (x: number) => (Number.isInteger(x) ? String(x) : x.toFixed(3));

type Line = { key: string; label: string; quantity: number; total_cents: number; unit_cents?: number };

/**
 * A price estimate as its viewer may read it (the server decides what is sent): the shop's staff
 * see each line's rate and the margin; a customer sees each line's amount with the margin already
 * spread over it. Then the price per piece and the total, then the nesting on the sheet.
 * Used by the flat-blank page (one blank) and the design check (the whole nested design).
 */
export function PriceBreakdown({ estimate: data, dimmed }: { estimate: PriceEstimate; dimmed?: boolean }) {
  const money = (c: number) => formatMoney(c, data.currency);
  const p = data.price;
  // a line the design does not use (no bends on a drawn can) is left out of the reading, not of the sum
  const lines: Line[] = p.lines.filter((l) => l.quantity !== 0 || l.total_cents !== 0);
  const columns: Column<Line>[] = [
    { key: "label", header: "Line", primary: true, cell: (l) => l.label },
    { key: "quantity", header: "Quantity", align: "end", className: "font-mono", cell: (l) => qty(l.quantity) },
    ...(p.view === "shop" ? [{ key: "unit", header: "Rate", align: "end" as const, className: "font-mono", cell: (l: Line) => money(l.unit_cents ?? 0) }] : []),
    { key: "amount", header: "Amount", align: "end", className: "font-mono", cell: (l) => money(l.total_cents) },
  ];
  const footer: FooterLine[] = [
    { key: "subtotal", label: p.view === "shop" ? "Subtotal (cost)" : "Subtotal", value: money(p.subtotal_cents), strong: true, testId: "price-subtotal" },
    ...(p.view === "shop" ? [{ key: "margin", label: `Margin ${p.marginPercent} %`, value: money(p.margin_cents), testId: "price-margin" }] : []),
    { key: "discount", label: `Quantity discount ${p.discountPercent} %`, value: money(-p.discount_cents) },
    { key: "rounding", label: "Rounding to whole cents per piece", value: money(p.rounding_cents) },
    { key: "unit", label: "Price per piece", value: money(p.unitPrice_cents), strong: true, testId: "unit-price" },
    { key: "total", label: `Total for ${p.quantity}`, value: money(p.total_cents), strong: true, testId: "total-price" },
  ];
  return (
    <div className={`space-y-6 ${dimmed ? "stale" : ""}`} data-price-view={p.view}>
      <ResponsiveTable<Line>
        caption={`Price build-up for ${p.quantity} pieces`}
        testId="price-table"
        rowTestId="price-line"
        columns={columns}
        rows={lines}
        rowKey={(l) => l.key}
        footer={footer}
        cardsBelow={520}
      />
      <p className="text-meta text-flux-600">
        Prices in {data.currency}, an estimate from price list version {data.priceListVersion}; a quote fixes the price. Setup is spread over the quantity: {money(p.setupPerUnit_cents)} a piece.
        {p.view === "shop" ? " You see the shop's rates and margin; customers see each line's amount with the margin in it, and no rates." : ""}
      </p>
      {data.nesting.map((g) => (
        <div key={`${g.materialId}@${g.thickness_mm}`} className="space-y-2">
          <h3 className="text-h4">How the blanks sit on the stock sheet{data.nesting.length > 1 ? ` · ${g.materialId} ${g.thickness_mm} mm` : ""}</h3>
          {g.sheet ? <NestingSvg group={g} /> : <StatusNote tone="info">No stock sheet of {g.materialId} {g.thickness_mm} mm is listed; material is priced at the planner's assumed use of {(g.utilisation * 100).toFixed(0)} % of the sheet.</StatusNote>}
        </div>
      ))}
    </div>
  );
}
