import { paths } from "../../config/paths";
import { ButtonLink } from "../../components/ui/button";
import { PageHeader } from "../../components/ui/panel";

export function PublicHome() {
  return (
    <>
      <PageHeader
        eyebrow="Nickel-iron magnetic shields"
        title="Formed, hydrogen-annealed, measured"
        lead="Configure a shield, see its predicted attenuation, order it, and follow each lot through the shop to a certificate of the measured values."
      />
      <div className="flex flex-wrap gap-3">
        <ButtonLink to={paths.designCheck.href()} variant="primary">
          Check a design
        </ButtonLink>
        <ButtonLink to={paths.signIn.href()}>Sign in</ButtonLink>
        <ButtonLink to={paths.register.href()} variant="quiet">
          Create an account
        </ButtonLink>
      </div>
    </>
  );
}
