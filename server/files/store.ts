import { createHash, randomBytes } from "node:crypto";
import { createReadStream } from "node:fs";
import { mkdir, rename, rm } from "node:fs/promises";
import path from "node:path";

/**
 * Uploaded files on disk, outside the built client (the web root): each under a random name, in a
 * folder of two hex characters, never under the name it was uploaded with.
 */
export interface FileStore {
  root: string;
  /** where multer writes an upload while it is checked */
  incoming: string;
  /** moves a checked upload into the store; returns its storage key */
  keep(tempPath: string): Promise<string>;
  pathOf(storageKey: string): string;
  remove(storageKey: string): Promise<void>;
}

export function createFileStore(root: string): FileStore {
  const absolute = path.resolve(root);
  const incoming = path.join(absolute, "incoming");
  const ready = mkdir(incoming, { recursive: true, mode: 0o700 });
  const pathOf = (key: string) => {
    if (!/^[0-9a-f]{2}\/[0-9a-f]{40}$/.test(key)) throw new Error("not a storage key");
    return path.join(absolute, key);
  };
  return {
    root: absolute,
    incoming,
    async keep(tempPath) {
      await ready;
      const name = randomBytes(20).toString("hex");
      const key = `${name.slice(0, 2)}/${name}`;
      await mkdir(path.join(absolute, name.slice(0, 2)), { recursive: true, mode: 0o700 });
      await rename(tempPath, pathOf(key));
      return key;
    },
    pathOf,
    async remove(key) {
      await rm(pathOf(key), { force: true });
    },
  };
}

/** SHA-256 of a file, read as a stream (uploads may be 20 MB). */
export function sha256File(file: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const hash = createHash("sha256");
    createReadStream(file)
      .on("data", (chunk) => hash.update(chunk))
      .on("error", reject)
      .on("end", () => resolve(hash.digest("hex")));
  });
}
