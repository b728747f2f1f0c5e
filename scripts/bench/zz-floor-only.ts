import { benchShopFloor } from "./shop-floor";
const rows = await benchShopFloor(Number(process.env.BENCH_SECONDS ?? 3));
for (const r of rows) console.log(r.name.padEnd(80), String(r.value).padStart(10), r.unit, r.target ?? "", r.pass === undefined ? "" : r.pass ? "ok" : "MISSED");
process.exit(0);
