import type { Transaction } from "sequelize";
import type { FileStore } from "../files/store";
import { PAPER_RECORDS } from "../files/sniff";
import { checkUpload, type Upload } from "../files/upload";
import { StoredFile } from "../models";
import type { Actor } from "../policies/utils";
import { ValidationError } from "../errors";

/**
 * Keeps one scanned paper record (a mill certificate, a furnace chart): checked like a drawing but
 * only a PDF or an image, moved into the store under a random name, a stored_files row with its
 * SHA-256. If the transaction fails the kept file is removed again.
 */
export async function paperRecordKeeper(props: {
  actor: Actor;
  uploads: Upload[];
  purpose: "mill-certificate" | "furnace-chart";
  what: string;
  maxBytes: number;
  store: FileStore;
  transaction: Transaction;
}): Promise<StoredFile> {
  const { uploads, transaction } = props;
  if (uploads.length !== 1) throw ValidationError({ file: `choose ${props.what} to upload (one file)` });
  const u = uploads[0];
  const checked = await checkUpload(u, { field: "file", accepted: PAPER_RECORDS, what: props.what, maxBytes: props.maxBytes });
  const key = await props.store.keep(u.path);
  try {
    return await StoredFile.create(
      { organizationId: props.actor.organizationId, uploadedById: props.actor.id, purpose: props.purpose, filename: u.originalname, contentType: checked.mime, sizeBytes: u.size, sha256: checked.sha256, storageKey: key },
      { transaction },
    );
  } catch (err) {
    await props.store.remove(key);
    throw err;
  }
}
