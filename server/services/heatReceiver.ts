import type { Transaction } from "sequelize";
import type { HeatCreateInput } from "../../shared/schemas/heats";
import { isoDay } from "../../shared/shop-floor/due-dates";
import { ConflictError, ValidationError } from "../errors";
import type { FileStore } from "../files/store";
import type { Upload } from "../files/upload";
import { MaterialHeat, recordEvent } from "../models";
import type { Actor } from "../policies/utils";
import { materialCatalog } from "./materialCatalog";
import { paperRecordKeeper } from "./paperRecordKeeper";
import { MAX_CERTIFICATE_BYTES } from "../../shared/schemas/heats";

/**
 * Records a delivery of sheet: heat number, alloy (a library material), gauge, supplier, quantity.
 * One record per heat, alloy and gauge (a second is a 409 naming the first).
 */
export async function heatReceiver(props: { actor: Actor; input: Required<Pick<HeatCreateInput, "unit">> & HeatCreateInput; ip: string | null; transaction: Transaction; now?: Date }): Promise<MaterialHeat> {
  const { actor, input, transaction } = props;
  const catalog = await materialCatalog();
  if (!catalog.byId.has(input.materialId)) throw ValidationError({ materialId: `unknown alloy "${input.materialId}"; choose one of ${[...catalog.byId.keys()].join(", ")}` });
  const today = isoDay(props.now ?? new Date());
  if (input.receivedOn && input.receivedOn > today) throw ValidationError({ receivedOn: "cannot be in the future" });
  const existing = await MaterialHeat.findOne({ where: { heatNumber: input.heatNumber, materialId: input.materialId, thicknessMm: input.thickness_mm }, transaction });
  if (existing) throw ConflictError("HEAT_EXISTS", `Heat ${input.heatNumber} in ${input.materialId} ${input.thickness_mm} mm was already received on ${existing.receivedOn}; add to that record instead.`);
  const heat = await MaterialHeat.create(
    {
      heatNumber: input.heatNumber, materialId: input.materialId, thicknessMm: input.thickness_mm, supplier: input.supplier, quantity: input.quantity,
      unit: input.unit, receivedOn: input.receivedOn ?? today, receivedById: actor.id, notes: input.notes || null,
    },
    { transaction },
  );
  await recordEvent(
    { actor, action: "heat.received", subject: { type: "material_heat", id: heat.id }, data: { heatNumber: heat.heatNumber, materialId: heat.materialId, thickness_mm: heat.thicknessMm, supplier: heat.supplier, quantity: heat.quantity, unit: heat.unit }, ip: props.ip },
    transaction,
  );
  return heat;
}

/** Attaches (or replaces) a heat's mill certificate: a PDF or an image, kept like a drawing. */
export async function millCertificateAttacher(props: { actor: Actor; heat: MaterialHeat; uploads: Upload[]; store: FileStore; ip: string | null; transaction: Transaction }): Promise<MaterialHeat> {
  const { actor, heat, transaction } = props;
  const file = await paperRecordKeeper({ actor, uploads: props.uploads, purpose: "mill-certificate", what: "a mill certificate", maxBytes: MAX_CERTIFICATE_BYTES, store: props.store, transaction });
  const previous = heat.millCertificateFileId;
  heat.millCertificateFileId = file.id;
  await heat.save({ transaction });
  await recordEvent(
    { actor, action: "heat.certificate-attached", subject: { type: "material_heat", id: heat.id }, data: { fileId: file.id, filename: file.filename, sha256: file.sha256, replaced: previous }, ip: props.ip },
    transaction,
  );
  heat.millCertificate = file;
  return heat;
}
