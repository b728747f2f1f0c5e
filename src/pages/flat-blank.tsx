import { PageHeader } from "../components/ui/panel";
import { PanelBoundary } from "../components/error-boundary";
import { FlatBlankCalculator } from "../features/fabrication/flat-blank-calculator";

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
