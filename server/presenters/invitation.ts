import type { InvitationJson, InvitationPreviewJson } from "../../shared/schemas/people";
import type { AuthToken, Organization } from "../models";

// Staff join the shop's own organisation, so only a customer organisation is worth naming.
const customerName = (org: Organization | null | undefined) => (org?.kind === "customer" ? org.name : null);

/** An open invitation as the planner's list shows it (the token itself is never sent back). */
export function presentInvitation(invitation: AuthToken, organization: Organization | null | undefined): InvitationJson {
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role!,
    organizationId: invitation.organizationId,
    organizationName: customerName(organization),
    expiresAt: invitation.expiresAt.toISOString(),
    createdAt: invitation.createdAt.toISOString(),
  };
}

/** What the invited person is told before accepting. */
export function presentInvitationPreview(invitation: AuthToken, organization: Organization | null | undefined): InvitationPreviewJson {
  return { email: invitation.email, role: invitation.role!, organizationName: customerName(organization), expiresAt: invitation.expiresAt.toISOString() };
}
