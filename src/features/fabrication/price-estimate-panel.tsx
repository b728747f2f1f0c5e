import { useQuery } from "@tanstack/react-query";
import type { BlankRequest } from "../../../shared/schemas/blank";
import type { DesignConfigurationInput } from "../../../shared/schemas/price-estimate";
import { blamesInputs } from "../../api/client";
import { priceEstimateQueryOptions } from "../../api/fabrication";
import { ServerTrouble } from "../../components/server-trouble";
import { Panel } from "../../components/ui/panel";
import { Spinner } from "../../components/ui/spinner";
import { StatusNote } from "../../components/ui/status-note";
import { PriceBreakdown } from "../../components/pricing/price-breakdown";
import { useDebounced } from "../../lib/use-debounced";
import { useLastGood } from "../../lib/use-last-good";

/** One layer of the part shown; the page prices the blank on screen, so a box gets no lid here. */
export function configurationFor(request: BlankRequest, material: string): DesignConfigurationInput {
  const { material: _m, thickness_mm, ...rest } = request;
  return { ...rest, layers: [{ material, thickness_mm }], ...(request.method === "bent" ? { lid: false } : {}) };
}

/** quantity: a whole number of pieces, or null while the box holds something else (its own message says what). */
export function PriceEstimatePanel({ request, quantity }: { request: BlankRequest; quantity: number | null }) {
  const body = useDebounced({ configuration: request.material ? configurationFor(request, request.material) : null, quantity }, 300);
  const estimate = useQuery({
    ...priceEstimateQueryOptions({ configuration: body.configuration!, quantity: body.quantity ?? 1 }),
    enabled: body.configuration !== null && body.quantity !== null,
    retry: false,
  });
  const shown = useLastGood(estimate.data, estimate.isSuccess && !estimate.isPlaceholderData);
  if (!request.material) {
    return (
      <Panel title="Price">
        <StatusNote tone="info">Choose a material to see the price build-up.</StatusNote>
      </Panel>
    );
  }
  return (
    <Panel
      title="Price build-up"
      actions={estimate.isFetching ? <span className="flex items-center gap-2 text-meta text-flux-600"><Spinner /> Pricing…</span> : shown && <span className="text-meta text-flux-600">Price list version {shown.priceListVersion}</span>}
    >
      <div className="space-y-4">
        {estimate.isError && blamesInputs(estimate.error) && (
          <StatusNote tone="danger" word="No price for these values">
            {Object.keys(estimate.error.fields).length ? Object.values(estimate.error.fields).join(" ") : estimate.error.message}
          </StatusNote>
        )}
        {estimate.isError && !blamesInputs(estimate.error) && <ServerTrouble error={estimate.error} what="the price" kept={Boolean(shown)} onRetry={() => void estimate.refetch()} />}
        {!shown && estimate.isPending && body.quantity !== null && <p className="text-flux-600">Pricing…</p>}
        {shown && <PriceBreakdown estimate={shown} dimmed={estimate.isError || estimate.isPlaceholderData || quantity === null} />}
      </div>
    </Panel>
  );
}
