import type { Transaction } from "sequelize";
import type { MaterialCreate, MaterialUpdate } from "../../shared/schemas/material";
import { ConflictError, NotFoundError } from "../errors";
import { Material, recordEvent } from "../models";
import { materialAttributes } from "../models/Material";
import type { Actor } from "../policies/utils";
import { presentMaterialForAdmin } from "../presenters/material";
import { jsonDiff } from "./shopRatesUpdater";

type Snapshot = ReturnType<typeof presentMaterialForAdmin>;
const comparable = ({ createdAt: _c, updatedAt: _u, ...rest }: Snapshot) => rest;

/** Replaces a material's values; the event keeps the whole before and after and the difference. */
export async function materialUpdater(props: { actor: Actor; id: string; input: MaterialUpdate; ip: string | null; transaction: Transaction }) {
  const { transaction } = props;
  const material = await Material.findByPk(props.id, { transaction, lock: transaction.LOCK.UPDATE });
  if (!material) throw NotFoundError("material");
  const before = comparable(presentMaterialForAdmin(material));
  await material.update(materialAttributes(props.input), { transaction });
  const after = comparable(presentMaterialForAdmin(material));
  await recordEvent(
    { actor: props.actor, action: "material.updated", subject: { type: "material", id: material.id }, data: { before, after, changes: jsonDiff(before, after) }, ip: props.ip },
    transaction,
  );
  return material;
}

/** Adds a material to the library; an existing id is a 409. */
export async function materialCreator(props: { actor: Actor; input: MaterialCreate; ip: string | null; transaction: Transaction }) {
  const { transaction, input } = props;
  if (await Material.findByPk(input.id, { transaction })) throw ConflictError("MATERIAL_EXISTS", `A material with the id "${input.id}" already exists.`);
  const material = await Material.create({ id: input.id, ...materialAttributes(input) }, { transaction });
  await recordEvent(
    { actor: props.actor, action: "material.created", subject: { type: "material", id: material.id }, data: { before: null, after: comparable(presentMaterialForAdmin(material)) }, ip: props.ip },
    transaction,
  );
  return material;
}
