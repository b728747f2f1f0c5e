import { useQuery } from "@tanstack/react-query";
import type { BlankRequest } from "../../../shared/schemas/blank";
import type { DesignConfigurationInput } from "../../../shared/schemas/price-estimate";
import { ApiError } from "../../api/client";
import { priceEstimateQueryOptions } from "../../api/fabrication";
import { Panel } from "../../components/ui/panel";
import { Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { formatMoney } from "./money";
import { NestingSvg } from "./nesting-svg";
import { useDebounced } from "./use-debounced";

/** One layer of the part shown; the page prices the blank on screen, so a box gets no lid here. */
export function configurationFor(request: BlankRequest, material: string): DesignConfigurationInput {
  const { material: _m, thickness_mm, ...rest } = request;
  return { ...rest, layers: [{ material, thickness_mm }], ...(request.method === "bent" ? { lid: false } : {}) };
}

const qty = (x: number) => (Number.isInteger(x) ? String(x) : x.toFixed(3));

export function PriceEstimatePanel({ request, quantity }: { request: BlankRequest; quantity: string }) {
  const body = useDebounced({ configuration: request.material ? configurationFor(request, request.material) : null, quantity: Number(quantity) }, 300);
  const estimate = useQuery({
    ...priceEstimateQueryOptions({ configuration: body.configuration!, quantity: body.quantity }),
    enabled: body.configuration !== null,
    retry: false,
  });
  if (!request.material) {
    return (
      <Panel title="Price">
        <StatusNote tone="info">Choose a material to see the price build-up.</StatusNote>
      </Panel>
    );
  }
  const data = estimate.data;
  const money = (c: number) => formatMoney(c, data?.currency ?? "EUR");
  return (
    <Panel
      title="Price build-up"
      actions={estimate.isFetching ? <span className="flex items-center gap-2 text-meta text-flux-600"><Spinner /> Pricing…</span> : data && <span className="text-meta text-flux-600">Price list version {data.priceListVersion}</span>}
    >
      {estimate.isError && (
        <StatusNote tone="danger" word="No price">
          {estimate.error instanceof ApiError && Object.keys(estimate.error.fields).length ? Object.values(estimate.error.fields).join(" ") : (estimate.error as Error).message}
        </StatusNote>
      )}
      {!data && estimate.isPending && <p className="text-flux-600">Pricing…</p>}
      {data && (
        <div className={`space-y-6 ${estimate.isError || estimate.isPlaceholderData ? "opacity-60" : ""}`}>
          <div className="overflow-x-auto">
            <table className="w-full min-w-[36rem] text-left text-body" data-testid="price-table">
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
          </div>
          <p className="text-meta text-flux-600">Prices in {data.currency}. Setup is spread over the quantity: {money(data.price.setupPerUnit_cents)} a piece.</p>
          {data.nesting.map((g) => (
            <div key={`${g.materialId}@${g.thickness_mm}`} className="space-y-2">
              <h3 className="text-h4">Nesting on the stock sheet</h3>
              {g.sheet ? <NestingSvg group={g} /> : <StatusNote tone="info">No stock sheet of {g.materialId} {g.thickness_mm} mm is listed; material is priced at the planner's assumed utilisation of {(g.utilisation * 100).toFixed(0)} %.</StatusNote>}
            </div>
          ))}
        </div>
      )}
    </Panel>
  );
}
