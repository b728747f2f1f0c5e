// Runs every benchmark section and prints one table; exits 1 when a target is missed.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { benchInitialJs } from "./client";
import { benchHttp, type HttpCase } from "./http";
import type { BenchRow } from "./types";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const rows: BenchRow[] = [];
const section = (title: string) => rows.push({ name: `— ${title}`, value: NaN, unit: "" });
// BENCH_ONLY=shop-floor,ordering runs just those sections (names as in `wants` below)
const only = process.env.BENCH_ONLY?.split(",").map((s) => s.trim()).filter(Boolean);
const wants = (name: string) => !only || only.includes(name);

// Sections contributed by the engines, loaded when present.
for (const [file, fn, title] of [
  ["./physics", "benchPhysics", "prediction engine (in-process)"],
  ["./fabrication", "benchFabrication", "fabrication engine (in-process)"],
  ["./advisor", "benchAdvisor", "design advisor (in-process)"],
  ["./calibration", "benchCalibration", "calibration from measured lots (in-process)"],
] as const) {
  if (!wants(file.slice(2))) continue;
  try {
    const mod = (await import(file)) as Record<string, () => BenchRow[]>;
    section(title);
    rows.push(...mod[fn]());
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== "ERR_MODULE_NOT_FOUND") throw err;
  }
}

if (wants("certificate")) {
  section("certificate of conformance (in-process)");
  rows.push(...(await (await import("./certificate")).benchCertificate()));
}

if (wants("http")) {
  section("HTTP, 10 connections, RATE_LIMIT_PUBLIC=0");
  const cases: HttpCase[] = [{ name: "health", path: "/api/health", minRatio: 0.8 }];
  try {
    const { httpCases } = (await import("./http-cases")) as { httpCases: HttpCase[] };
    cases.push(...httpCases);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== "ERR_MODULE_NOT_FOUND") throw err;
  }
  rows.push(...(await benchHttp(cases, Number(process.env.BENCH_SECONDS ?? 3))));
}

if (wants("ordering")) {
  section("ordering, 10 connections");
  rows.push(...(await (await import("./ordering")).benchOrdering(Number(process.env.BENCH_SECONDS ?? 3))));
}

if (wants("shop-floor")) {
  section("shop floor: 100 000 jobs, 1 000 000 scans");
  rows.push(...(await (await import("./shop-floor")).benchShopFloor(Number(process.env.BENCH_SECONDS ?? 3))));
}

if (wants("advisor")) {
  section("design advisor route (signed in)");
  rows.push(...(await (await import("./advisor-route")).benchAdvisorRoute()));
}

if (wants("client")) {
  section("client");
  rows.push(...benchInitialJs(path.join(root, "dist")));
}

const width = Math.max(...rows.map((r) => r.name.length)) + 2;
for (const r of rows) {
  if (Number.isNaN(r.value)) { console.log(`\n${r.name}`); continue; }
  const verdict = r.pass === undefined ? "" : r.pass ? "  ok" : "  MISSED";
  console.log(`${r.name.padEnd(width)}${String(r.value).padStart(10)} ${r.unit.padEnd(6)}${r.target ? `  target ${r.target}` : ""}${verdict}`);
}
const missed = rows.filter((r) => r.pass === false).length;
console.log(missed ? `\n${missed} target(s) missed` : "\nall targets met");
process.exit(missed ? 1 : 0);
