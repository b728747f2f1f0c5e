import { readFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";
import type { BenchRow } from "./types";

/** Gzip size of the JavaScript the first page load fetches: the entry script and its modulepreloads. */
export function benchInitialJs(distDir: string, limitKb = 200): BenchRow[] {
  const html = readFileSync(path.join(distDir, "index.html"), "utf8");
  const files = new Set<string>();
  for (const m of html.matchAll(/<script[^>]+src="([^"]+\.js)"/g)) files.add(m[1]);
  for (const m of html.matchAll(/<link[^>]+rel="modulepreload"[^>]+href="([^"]+\.js)"/g)) files.add(m[1]);
  let bytes = 0;
  for (const f of files) bytes += gzipSync(readFileSync(path.join(distDir, f.replace(/^\//, "")))).length;
  const kb = bytes / 1024;
  return [{ name: `initial client JavaScript, gzip (${files.size} files)`, value: Number(kb.toFixed(1)), unit: "kB", target: `<= ${limitKb} kB`, pass: kb <= limitKb }];
}
