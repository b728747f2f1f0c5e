import type { Organization } from "../models";

export function presentOrganization(org: Organization) {
  return { id: org.id, name: org.name, kind: org.kind };
}
