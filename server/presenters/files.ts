import type { StoredFileJson } from "../../shared/schemas/files";
import type { StoredFile } from "../models";

/** A kept file as the answers name it, with the address that downloads it. */
export function presentStoredFile(f: StoredFile, url: string): StoredFileJson {
  return { id: f.id, filename: f.filename, contentType: f.contentType, sizeBytes: f.sizeBytes, sha256: f.sha256, uploadedAt: f.createdAt.toISOString(), url };
}
