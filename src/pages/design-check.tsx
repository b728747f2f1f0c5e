import { useQuery, type QueryClient } from "@tanstack/react-query";
import { meQueryOptions } from "../api/auth";
import { materialsQueryOptions } from "../api/materials";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { DesignCheck } from "../features/design-check/design-check";
import { warm } from "../lib/guards";

// Public: anonymous visitors and signed-in customers use the same page.
export const makeLoader = (queryClient: QueryClient) => async () => {
  await warm(queryClient.ensureQueryData(materialsQueryOptions));
  return null;
};

export function Component() {
  // signed in, a customer configures here: the design is saved, compared and quoted from this page
  const customer = useQuery(meQueryOptions).data?.role === "customer";
  return (
    <>
      <PageHeader
        eyebrow={customer ? "Configure · save · quote" : "Public · no sign-in needed"}
        title="Design check"
        lead={`Describe a shield's shape, layers and the field it must block. The predicted attenuation, each layer's saturation margin, the curve against frequency and a drawing to scale update as you type.${customer ? " Save it under a name, then compare it or get a quote." : ""}`}
      />
      <PanelBoundary name="the design check">
        <DesignCheck />
      </PanelBoundary>
    </>
  );
}
