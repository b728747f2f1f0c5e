import type { QueryClient } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import type { AdvisedConfiguration } from "../../shared/schemas/design-advice";
import { materialsQueryOptions } from "../api/materials";
import { PanelBoundary } from "../components/error-boundary";
import { PageHeader } from "../components/ui/panel";
import { paths } from "../config/paths";
import { FindADesign } from "../features/design-advice/find-a-design";
import { designToParams } from "../features/design-check/design-url";
import { draftFromConfiguration } from "../features/design-check/draft-from-configuration";
import { requireUser, warm } from "../lib/guards";

// Signed in (customers and staff): the search is priced with the shop's current rates.
export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireUser(queryClient, request);
  await warm(queryClient.ensureQueryData(materialsQueryOptions));
  return null;
};

/** An advised design in the design check, every field filled: the page joins the two features. */
const designHref = (configuration: AdvisedConfiguration) => paths.designCheck.href(designToParams(draftFromConfiguration(configuration)));

export function Component() {
  return (
    <>
      <PageHeader
        eyebrow="Signed in · customers and shop staff"
        title="Find a design"
        lead="Say what must fit inside, the field it sits in and the attenuation you need: the designs the shop can make that meet it, what each costs and weighs, and the one we would choose."
      />
      <PanelBoundary name="the design search">
        <FindADesign designHref={designHref} />
      </PanelBoundary>
    </>
  );
}
