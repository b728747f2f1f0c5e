import { designSummary, type DesignJson } from "../../shared/schemas/design";
import type { Design } from "../models";
import { designPolicy } from "../policies/design";
import { abilities, type Actor } from "../policies/utils";

export function presentDesign(design: Design, actor: Actor): DesignJson {
  const can = abilities(actor, designPolicy, design);
  return {
    id: design.id,
    name: design.name,
    organizationId: design.organizationId,
    configuration: design.configuration,
    summary: designSummary(design.configuration),
    createdBy: design.createdBy ? { id: design.createdBy.id, name: design.createdBy.name } : null,
    createdAt: design.createdAt.toISOString(),
    updatedAt: design.updatedAt.toISOString(),
    abilities: { update: can.update, delete: can.delete, quote: can.quote },
  };
}
