import { paths } from "../config/paths";
import { ButtonLink } from "../components/ui/button";
import { PageHeader } from "../components/ui/panel";

export function NotFoundContent() {
  return (
    <>
      <PageHeader eyebrow="404" title="Nothing at this address" lead="The link may be old or mistyped." />
      <ButtonLink to={paths.home.href()} variant="primary">
        Go to the home page
      </ButtonLink>
    </>
  );
}

export const Component = NotFoundContent;
