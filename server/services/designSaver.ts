import type { Transaction } from "sequelize";
import type { QuoteConfiguration } from "../../shared/schemas/quote";
import { Design, recordEvent } from "../models";
import type { Actor } from "../policies/utils";

/** Saves a new design for the actor's organisation, or renames / reconfigures an existing one. */
export async function designSaver(props: {
  actor: Actor;
  design?: Design;
  input: { name?: string; configuration?: QuoteConfiguration };
  ip: string | null;
  transaction: Transaction;
}): Promise<Design> {
  const { actor, input, transaction } = props;
  if (!props.design) {
    const design = await Design.create(
      { organizationId: actor.organizationId, createdById: actor.id, name: input.name!, configuration: input.configuration! },
      { transaction },
    );
    await recordEvent({ actor, action: "design.created", subject: { type: "design", id: design.id }, data: { name: design.name }, ip: props.ip }, transaction);
    return design;
  }
  const design = props.design;
  const changed: string[] = [];
  if (input.name !== undefined && input.name !== design.name) {
    changed.push("name");
    design.name = input.name;
  }
  if (input.configuration !== undefined) {
    changed.push("configuration");
    design.configuration = input.configuration;
  }
  if (changed.length) {
    await design.save({ transaction });
    await recordEvent(
      { actor, organizationId: design.organizationId, action: "design.updated", subject: { type: "design", id: design.id }, data: { fields: changed, name: design.name }, ip: props.ip },
      transaction,
    );
  }
  return design;
}

/** A copy under a new name ("… (copy)" by default), for a variant to compare. */
export async function designDuplicator(props: { actor: Actor; design: Design; name?: string; ip: string | null; transaction: Transaction }): Promise<Design> {
  const { actor, design, transaction } = props;
  const name = props.name ?? `${design.name.slice(0, 113)} (copy)`;
  const copy = await Design.create(
    { organizationId: design.organizationId, createdById: actor.id, name, configuration: design.configuration },
    { transaction },
  );
  await recordEvent(
    { actor, organizationId: design.organizationId, action: "design.duplicated", subject: { type: "design", id: copy.id }, data: { from: design.id, name }, ip: props.ip },
    transaction,
  );
  return copy;
}

/** Deletes a design; its quotes keep their own frozen copy of the configuration. */
export async function designDeleter(props: { actor: Actor; design: Design; ip: string | null; transaction: Transaction }): Promise<void> {
  const { actor, design, transaction } = props;
  await design.destroy({ transaction });
  await recordEvent(
    { actor, organizationId: design.organizationId, action: "design.deleted", subject: { type: "design", id: design.id }, data: { name: design.name }, ip: props.ip },
    transaction,
  );
}
