import { useQuery } from "@tanstack/react-query";
import type { BlankRequest } from "../../../shared/schemas/blank";
import type { DesignConfigurationInput } from "../../../shared/schemas/price-estimate";
import { ApiError } from "../../api/client";
import { priceEstimateQueryOptions } from "../../api/fabrication";
import { Panel } from "../../components/ui/panel";
import { Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { PriceBreakdown } from "../../components/pricing/price-breakdown";
import { useDebounced } from "../../lib/use-debounced";

/** One layer of the part shown; the page prices the blank on screen, so a box gets no lid here. */
export function configurationFor(request: BlankRequest, material: string): DesignConfigurationInput {
  const { material: _m, thickness_mm, ...rest } = request;
  return { ...rest, layers: [{ material, thickness_mm }], ...(request.method === "bent" ? { lid: false } : {}) };
}

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
      {data && <PriceBreakdown estimate={data} dimmed={estimate.isError || estimate.isPlaceholderData} />}
    </Panel>
  );
}
