import type { Request, Response } from "express";
import multer from "multer";
import { randomBytes } from "node:crypto";
import { rm } from "node:fs/promises";
import { AppError, ValidationError } from "../errors";
import { sha256File, type FileStore } from "./store";
import { badFilename, sniffFile, type Accepted } from "./sniff";

/** A file multer wrote to the store's incoming folder, not yet checked. */
export interface Upload {
  /** where multer wrote it */
  path: string;
  originalname: string;
  size: number;
}

const MB = 1024 * 1024;

/**
 * Reads the multipart files of form field `field` into the store's incoming folder under random
 * names (the caller checks and keeps or removes them). Limits are refused as 400/413 naming the field.
 */
export function receiveUploads(req: Request, res: Response, opts: { store: FileStore; field: string; maxBytes: number; maxFiles: number; what: string }): Promise<Upload[]> {
  const upload = multer({
    storage: multer.diskStorage({
      destination: opts.store.incoming,
      filename: (_req, _file, cb) => cb(null, randomBytes(16).toString("hex")),
    }),
    limits: { fileSize: opts.maxBytes, files: opts.maxFiles, fields: 10, parts: opts.maxFiles + 10 },
    // keep any folder in the name, so it is refused rather than silently cut off
    preservePath: true,
    // browsers send UTF-8 names without saying so
    defParamCharset: "utf8",
  }).array(opts.field, opts.maxFiles);
  const mb = `${Math.round(opts.maxBytes / MB)} MB`;
  return new Promise<Upload[]>((resolve, reject) => {
    upload(req, res, (err: unknown) => {
      const received = ((req.files as Express.Multer.File[] | undefined) ?? []).map((f) => ({ path: f.path, originalname: f.originalname, size: f.size }));
      if (!err) return resolve(received);
      void Promise.all(received.map((f) => rm(f.path, { force: true })));
      if (err instanceof multer.MulterError) {
        if (err.code === "LIMIT_FILE_SIZE") return reject(new AppError(413, "FILE_TOO_LARGE", `${capital(opts.what)} is larger than ${mb}.`, { [opts.field]: `is larger than ${mb}` }));
        if (err.code === "LIMIT_FILE_COUNT") return reject(ValidationError({ [opts.field]: `send at most ${opts.maxFiles} ${opts.maxFiles === 1 ? "file" : "files"}` }));
        if (err.code === "LIMIT_UNEXPECTED_FILE") return reject(ValidationError({ [opts.field]: `send the file in the form field "${opts.field}"` }));
        return reject(ValidationError({ [opts.field]: err.message }));
      }
      reject(err);
    });
  });
}

export const discardUploads = (uploads: Upload[]) => Promise.all(uploads.map((u) => rm(u.path, { force: true })));

/**
 * Checks one upload before it is kept: a plain name, not empty, within the size, and by its
 * content one of the accepted kinds with a name that agrees. Returns its type and SHA-256.
 */
export async function checkUpload(u: Upload, opts: { field: string; accepted: Accepted; what: string; maxBytes: number }): Promise<{ mime: string; sha256: string }> {
  const nameProblem = badFilename(u.originalname);
  if (nameProblem) throw ValidationError({ [opts.field]: nameProblem });
  if (u.size === 0) throw ValidationError({ [opts.field]: `${u.originalname} is empty` });
  const mb = `${Math.round(opts.maxBytes / MB)} MB`;
  if (u.size > opts.maxBytes) throw new AppError(413, "FILE_TOO_LARGE", `${u.originalname} is larger than ${mb}.`, { [opts.field]: `is larger than ${mb}` });
  const sniffed = await sniffFile(u.path, u.originalname, opts.accepted);
  if (!sniffed.ok) throw ValidationError({ [opts.field]: `${u.originalname}: ${sniffed.reason}` }, `This file cannot be attached as ${opts.what}.`);
  return { mime: sniffed.mime, sha256: await sha256File(u.path) };
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
