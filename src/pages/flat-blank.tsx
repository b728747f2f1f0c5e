import type { QueryClient } from "@tanstack/react-query";
import { materialsQueryOptions } from "../api/materials";
import { PageHeader } from "../components/ui/panel";
import { PanelBoundary } from "../components/error-boundary";
import { FlatBlankCalculator } from "../features/fabrication/flat-blank-calculator";
import { warm } from "../lib/guards";

// Public, like the design check; the material list comes from the server's library.
export const makeLoader = (queryClient: QueryClient) => async () => {
  await warm(queryClient.ensureQueryData(materialsQueryOptions));
  return null;
};

export function Component() {
  return (
    <>
      <PageHeader
        eyebrow="Public · no sign-in needed"
        title="Flat blank"
        lead="Enter the inside dimensions of a bent box or a drawn or rolled can and see the blank it is cut from, its bend allowance or draw stages, and the flat pattern to scale. Signed in, you also see the price."
      />
      <PanelBoundary name="the flat blank calculator">
        <FlatBlankCalculator />
      </PanelBoundary>
    </>
  );
}
