import type { Transaction } from "sequelize";
import { MAX_DRAWINGS_PER_ORDER, MAX_DRAWING_BYTES } from "../../shared/schemas/order";
import { ConflictError, ValidationError } from "../errors";
import type { FileStore } from "../files/store";
import { DRAWINGS } from "../files/sniff";
import { checkUpload, type Upload } from "../files/upload";
import { OrderFile, StoredFile, recordEvent, type Order } from "../models";
import { orderStatusAllows } from "../policies/order";
import type { Actor } from "../policies/utils";

export type { Upload };

/**
 * Attaches drawings to an order (locked by the caller). Every file is checked before any is kept:
 * a plain name, not empty, at most 20 MB, a PDF, DXF, STEP or image by its content with a matching
 * extension, and at most 10 per order. Kept files get a random name in the store and a
 * stored_files row with their SHA-256; if the transaction fails the kept files are removed again.
 */
export async function drawingUploader(props: { actor: Actor; order: Order; uploads: Upload[]; store: FileStore; ip: string | null; transaction: Transaction }): Promise<StoredFile[]> {
  const { actor, order, uploads, transaction } = props;
  if (!orderStatusAllows.upload(order)) throw ConflictError("ORDER_LOCKED", "Drawings can be attached until the order is released to production.");
  if (uploads.length === 0) throw ValidationError({ file: "choose a drawing to upload" });
  const existing = await OrderFile.count({ where: { orderId: order.id }, transaction });
  if (existing + uploads.length > MAX_DRAWINGS_PER_ORDER) {
    throw ValidationError({ file: `an order takes at most ${MAX_DRAWINGS_PER_ORDER} drawings; it has ${existing}` }, "Too many drawings for this order.");
  }
  const checked: Array<Upload & { mime: string; sha256: string }> = [];
  for (const [i, u] of uploads.entries()) {
    const field = uploads.length === 1 ? "file" : `file.${i}`;
    checked.push({ ...u, ...(await checkUpload(u, { field, accepted: DRAWINGS, what: "a drawing", maxBytes: MAX_DRAWING_BYTES })) });
  }

  const kept: string[] = [];
  try {
    const files: StoredFile[] = [];
    for (const u of checked) {
      const key = await props.store.keep(u.path);
      kept.push(key);
      const file = await StoredFile.create(
        { organizationId: order.organizationId, uploadedById: actor.id, purpose: "order-drawing", filename: u.originalname, contentType: u.mime, sizeBytes: u.size, sha256: u.sha256, storageKey: key },
        { transaction },
      );
      await OrderFile.create({ orderId: order.id, storedFileId: file.id }, { transaction });
      await recordEvent(
        { actor, organizationId: order.organizationId, action: "drawing.uploaded", subject: { type: "order", id: order.id }, data: { fileId: file.id, filename: file.filename, sha256: file.sha256, sizeBytes: file.sizeBytes }, ip: props.ip },
        transaction,
      );
      files.push(file);
    }
    return files;
  } catch (err) {
    await Promise.all(kept.map((k) => props.store.remove(k)));
    throw err;
  }
}

/** Removes a drawing from an order before release (the file itself goes once the change commits). */
export async function drawingRemover(props: { actor: Actor; order: Order; file: StoredFile; store: FileStore; ip: string | null; transaction: Transaction }): Promise<void> {
  const { actor, order, file, transaction } = props;
  if (!orderStatusAllows.upload(order)) throw ConflictError("ORDER_LOCKED", "Drawings can be changed until the order is released to production.");
  await OrderFile.destroy({ where: { orderId: order.id, storedFileId: file.id }, transaction });
  await file.destroy({ transaction });
  await recordEvent({ actor, organizationId: order.organizationId, action: "drawing.removed", subject: { type: "order", id: order.id }, data: { fileId: file.id, filename: file.filename }, ip: props.ip }, transaction);
  transaction.afterCommit(() => void props.store.remove(file.storageKey).catch(() => {}));
}
