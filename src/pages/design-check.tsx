import { PageHeader, Panel } from "../components/ui/panel";
import { StatusNote } from "../components/ui/status-note";

// Placeholder route module: the design-check feature replaces this page's body. A page module
// exports `Component` and, if it needs data, `makeLoader(queryClient)` (see src/router.tsx).
export function Component() {
  return (
    <>
      <PageHeader
        eyebrow="Public · no sign-in needed"
        title="Design check"
        lead="Enter a shield's shape, layers and the field it must block, and see the predicted attenuation and saturation margin of each layer."
      />
      <Panel>
        <StatusNote tone="info" word="Coming soon">
          The design check is being built. It will be open to everyone, signed in or not.
        </StatusNote>
      </Panel>
    </>
  );
}
