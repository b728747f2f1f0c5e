import type { Request, Response } from "express";
import multer from "multer";
import { randomBytes } from "node:crypto";
import { rm } from "node:fs/promises";
import { AppError, ValidationError } from "../errors";
import type { FileStore } from "./store";

export interface Upload {
  /** where multer wrote it, in the store's incoming folder */
  path: string;
  originalname: string;
  size: number;
}

/**
 * Reads a multipart form: files of one field into the store's incoming folder under random names
 * (checked, then kept or removed by the caller), and the text fields into `fields`. Size and count
 * limits become the API's 413/400; on any failure the received files are removed at once.
 */
export function createReceiver(props: { store: FileStore; field: string; maxBytes: number; maxFiles: number; what: string }) {
  const { store, field, maxBytes, maxFiles, what } = props;
  const megabytes = Math.round(maxBytes / 1024 / 1024);
  const upload = multer({
    storage: multer.diskStorage({
      destination: store.incoming,
      filename: (_req, _file, cb) => cb(null, randomBytes(16).toString("hex")),
    }),
    limits: { fileSize: maxBytes, files: maxFiles, fields: 20, fieldSize: 10_000, parts: maxFiles + 20 },
    // keep any folder in the name, so it is refused rather than silently cut off
    preservePath: true,
    // browsers send UTF-8 names without saying so
    defParamCharset: "utf8",
  }).array(field, maxFiles);

  return (req: Request, res: Response) =>
    new Promise<{ files: Upload[]; fields: Record<string, unknown> }>((resolve, reject) => {
      upload(req, res, (err: unknown) => {
        const files = ((req.files as Express.Multer.File[] | undefined) ?? []).map((f) => ({ path: f.path, originalname: f.originalname, size: f.size }));
        if (!err) return resolve({ files, fields: { ...(req.body as Record<string, unknown> | undefined) } });
        void Promise.all(files.map((f) => rm(f.path, { force: true })));
        if (err instanceof multer.MulterError) {
          if (err.code === "LIMIT_FILE_SIZE") return reject(new AppError(413, "FILE_TOO_LARGE", `The ${what} is larger than ${megabytes} MB.`, { [field]: `is larger than ${megabytes} MB` }));
          if (err.code === "LIMIT_FILE_COUNT") return reject(ValidationError({ [field]: `send at most ${maxFiles} file${maxFiles === 1 ? "" : "s"}` }));
          if (err.code === "LIMIT_UNEXPECTED_FILE") return reject(ValidationError({ [field]: `send the ${what} in the form field "${field}"` }));
          return reject(ValidationError({ [field]: err.message }));
        }
        reject(err);
      });
    });
}

/** Removes what multer wrote (after the upload was kept, moved, or refused). */
export async function discardUploads(files: Upload[]): Promise<void> {
  await Promise.all(files.map((f) => rm(f.path, { force: true })));
}
