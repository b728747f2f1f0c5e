import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";

/**
 * The checkout (or deployment) folder: the nearest one above this file holding package.json. The
 * same answer whether the server runs from its sources (server/) or compiled (build/server/).
 */
function findProjectRoot(from: string): string {
  for (let dir = from; ; dir = path.dirname(dir)) {
    if (existsSync(path.join(dir, "package.json"))) return dir;
    if (path.dirname(dir) === dir) throw new Error(`no package.json above ${from}`);
  }
}

export const projectRoot = findProjectRoot(path.dirname(fileURLToPath(import.meta.url)));
