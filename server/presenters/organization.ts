import type { OrganizationJson } from "../../shared/schemas/people";
import type { Organization } from "../models";

export function presentOrganization(org: Organization): OrganizationJson {
  return { id: org.id, name: org.name, kind: org.kind };
}
