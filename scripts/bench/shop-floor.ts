// Shop-floor figures on a cluster loaded for the run with 100 000 jobs and 1 000 000 scan events
// (generate_series, in a few statements): POST /api/scans against pgbench's small-write rate
// (`pgbench -N`, 10 clients) measured on the same cluster in the same run, the job lookup by code,
// and the floor board's statement.
import autocannon from "autocannon";
import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import pg from "pg";
import { Sequelize } from "sequelize";
import { floorBoard } from "../../server/services/floorBoard";
import { median, serve } from "./http";
import type { BenchRow } from "./types";

const here = path.dirname(fileURLToPath(import.meta.url));
const JOBS = 100_000;
const SCANS = 1_000_000;
const JOBS_PER_LOT = 5;
// the floor's lots by their order of release: finished and shipped up to FINISHED, annealed (at
// verify or pack) up to ANNEALED, spread over the steps before the anneal up to STARTED, and the
// rest just issued, waiting at the blank for the scan benchmark
const FINISHED = 16_800;
const ANNEALED = 17_200;
const STARTED = 17_600;
const FINISHED_JOBS = FINISHED * JOBS_PER_LOT;

const ROUTING = JSON.stringify([
  { key: "material" }, { key: "blank" }, { key: "form", drawStages: 2, processAnneals: 1 }, { key: "clean" }, { key: "anneal" }, { key: "verify" }, { key: "pack" },
]);
const STEPS = ["material", "blank", "form", "clean", "anneal", "verify", "pack"];

/**
 * The floor of a shop some years in: 84 % of the jobs finished and shipped, 2 000 in verify and pack
 * after their furnace run, 2 000 spread over the steps before the anneal, and 12 000 just issued
 * (material done, waiting for the blank) for the scan benchmark to move on. 1 000 000 scans for the
 * finished ones. Loaded with the foreign-key triggers off (session_replication_role), as a restore would.
 */
async function loadFloor(client: pg.Client): Promise<{ firstSeq: number }> {
  const loaded = await client.query(`select min(j.seq) as seq from jobs j join lots l on l.id = j.lot_id where l.number like 'LB-%'`);
  if (loaded.rows[0].seq !== null) return { firstSeq: Number(loaded.rows[0].seq) }; // a cluster kept from an earlier run
  const { rows: [order] } = await client.query(`select id from orders order by number limit 1`);
  const { rows: [operator] } = await client.query(`select id from users where email = 'operator@demo.test'`);
  await client.query("set session_replication_role = replica");
  await client.query("begin");
  const { rows: [run] } = await client.query(
    `insert into furnace_runs (seq, number, furnace_id, furnace, material_id, peak_temperature_c, soak_min, dew_point_c, cooling_rate_c_per_h, "window", within_window, lots, pieces, load_kg)
     values (nextval('furnace_run_number_seq'), 'FR-BENCH', 'H2-1', '{"id":"H2-1","name":"Hydrogen furnace 1","maxLoad_kg":250}', 'ni80', 1150, 180, -50, 200, '{}', true, '[]', 0, 0) returning id`,
  );
  const { rows: [shipment] } = await client.query(`insert into shipments (order_id, carrier, tracking_number, parts) values ($1, 'Bench Freight', 'BENCH', '[]') returning id`, [order.id]);
  const lots = JOBS / JOBS_PER_LOT;
  await client.query(
    `insert into lots (seq, number, order_id, material_id, pieces, mass_kg, due_date, furnace_run_id, shipment_id, created_at)
     select nextval('lot_number_seq'), 'LB-' || g, $1, 'ni80', 5, 1.5, current_date + (g % 40) - 20,
       case when g <= ${ANNEALED} then $2::uuid end, case when g <= ${FINISHED} then $3::uuid end, now() - ((${lots} - g) / 20) * interval '1 day'
     from generate_series(1, ${lots}) g`,
    [order.id, run.id, shipment.id],
  );
  const { rows: [first] } = await client.query(`select min(seq) as seq from lots where number like 'LB-%'`);
  const lot0 = Number(first.seq) - 1;
  // job n of lot g: finished, at verify or pack, spread before the anneal, or waiting at the blank (the lots above)
  await client.query(
    `insert into jobs (order_id, lot_id, layer, role, method, material_id, thickness_mm, quantity, finished_piece, blank, flat_pattern, area_mm2, mass_kg,
       draw_stages, process_anneals, routing, step_index, step_started_at, current_step, anneal_index, due_date, completed_at, created_at)
     select $1, l.id, n % 2, 'cup', 'drawn', 'ni80', 1, 5, true, '{"kind":"disc","diameter_mm":150}', '{"outline":[],"bendLines":[],"reliefs":[],"circles":[]}', 17671, 0.15,
       2, 1, $2::jsonb, s.idx, case when s.started then now() end, case when s.idx < 7 then (array[${STEPS.map((k) => `'${k}'`).join(",")}])[s.idx + 1] end, 4,
       l.due_date, case when s.idx = 7 then l.created_at + interval '10 days' end, l.created_at
     from generate_series(1, ${JOBS}) n
     join lots l on l.seq = ${lot0} + (n - 1) / ${JOBS_PER_LOT} + 1
     cross join lateral (select
       case when (n - 1) / ${JOBS_PER_LOT} + 1 <= ${FINISHED} then 7
            when (n - 1) / ${JOBS_PER_LOT} + 1 <= ${ANNEALED} then 5 + n % 2
            when (n - 1) / ${JOBS_PER_LOT} + 1 <= ${STARTED} then n % 5
            else 1 end as idx,
       (n % 3 = 0 and (n - 1) / ${JOBS_PER_LOT} + 1 between ${FINISHED + 1} and ${STARTED}) as started) s
     order by n`,
    [order.id, ROUTING],
  );
  const { rows: [jobs] } = await client.query(`select min(seq) as seq from jobs where lot_id in (select id from lots where number like 'LB-%')`);
  const firstSeq = Number(jobs.seq);
  // ten scans (steps 0–4, start and complete) for each finished job, and the verify step of as many as make SCANS
  await client.query(
    `with finished as (
       select j.id, j.created_at, row_number() over (order by j.seq) as r
       from jobs j join lots l on l.id = j.lot_id where l.number like 'LB-%' and j.completed_at is not null)
     insert into scans (job_id, step_index, step, action, station, operator_id, scanned_at, created_at)
     select f.id, st.i, (array[${STEPS.map((k) => `'${k}'`).join(",")}])[st.i + 1], a.action, 'floor tablet', $1, f.created_at + st.i * interval '1 hour', f.created_at + st.i * interval '1 hour'
     from finished f
     cross join generate_series(0, 5) st(i)
     cross join (values ('start'), ('complete')) a(action)
     where st.i < 5 or f.r <= ${(SCANS - FINISHED_JOBS * 10) / 2}`,
    [operator.id],
  );
  await client.query("commit");
  await client.query("set session_replication_role = origin");
  await client.query("vacuum analyze lots, jobs, scans");
  await client.query("checkpoint");
  return { firstSeq };
}

/**
 * A cluster kept from an earlier run has its waiting jobs moved on by that run's scans: the jobs go
 * back to the blank and those scans go (as a restore would, with the append-only trigger off).
 */
async function putBackBenchScans(client: pg.Client): Promise<void> {
  await client.query(
    `with t as (select distinct job_id from scans where station = 'bench station')
     update jobs j set step_index = 1, current_step = 'blank', step_started_at = null, completed_at = null from t where j.id = t.job_id`,
  );
  await client.query("set session_replication_role = replica");
  await client.query("delete from scans where station = 'bench station'");
  await client.query("set session_replication_role = origin");
  await client.query("vacuum analyze jobs, scans");
}

/** CPU time (user + system) a process and its children (the server's workers) have used so far, in ms (Linux clock ticks of 10 ms). */
function cpuMs(pid: number): number {
  const stat = (p: string) => readFileSync(`/proc/${p}/stat`, "utf8").split(") ")[1].split(" ");
  let total = 0;
  for (const p of readdirSync("/proc").filter((d) => /^\d+$/.test(d))) {
    try {
      const fields = stat(p);
      // fields[1] is the parent's pid
      if (Number(p) === pid || Number(fields[1]) === pid) total += (Number(fields[11]) + Number(fields[12])) * 10;
    } catch {
      // a process that ended while the list was read
    }
  }
  return total;
}

function pgbenchBin(): string {
  const dir = readdirSync("/usr/lib/postgresql").sort((a, b) => Number(b) - Number(a))[0];
  return `/usr/lib/postgresql/${dir}/bin`;
}

/** pgbench's small-write transactions per second (`-N`, 10 clients), on the same cluster. */
function pgbenchTps(url: URL, seconds: number): number {
  const out = execFileSync(`${pgbenchBin()}/pgbench`, ["-h", url.hostname, "-p", url.port, "-U", url.username || "postgres", "-N", "-c", "10", "-j", "2", "-n", "-T", String(seconds), "fluxwright_pgbench"], { encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] });
  const m = /tps = ([\d.]+) \(without initial connection time\)/.exec(out) ?? /tps = ([\d.]+)/.exec(out);
  if (!m) throw new Error(`pgbench gave no tps:\n${out}`);
  return Number(m[1]);
}

async function signIn(base: string, email: string): Promise<{ cookie: string; csrf: string }> {
  const cookies = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair.indexOf("=");
      cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
  };
  const header = () => [...cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  const login = await fetch(`${base}/api/auth/login`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email, password: process.env.DEMO_PASSWORD ?? "fluxwright-demo" }) });
  if (!login.ok) throw new Error(`bench sign-in failed: ${login.status}`);
  keep(login);
  const csrf = await fetch(`${base}/api/auth/csrf`, { headers: { cookie: header() } });
  keep(csrf);
  return { cookie: header(), csrf: ((await csrf.json()) as { csrfToken: string }).csrfToken };
}

/**
 * Scans per second: ten stations, each job moved on (blank start and complete, form start and
 * complete with its draws, clean start and complete), driven by wrk (scans.lua). wrk is C, as
 * pgbench's own client is: both load generators take their share of the same two cores, and
 * autocannon's JavaScript client took 0.15–0.45 ms of CPU per scan, a tenth of the machine, that a
 * station on the floor never costs the server. Every answer must be a new event: wrk counts the
 * answers that were not 2xx, and the events recorded must be as many as the answers (a repeat,
 * answered 200, records nothing).
 */
async function scanRate(base: string, sessions: Array<{ cookie: string; csrf: string }>, codes: string[], seconds: number, db: pg.Client): Promise<number> {
  const dir = mkdtempSync(path.join(tmpdir(), "fluxwright-scans-"));
  try {
    const input = path.join(dir, "input.txt");
    writeFileSync(input, [...sessions.map((s) => `${s.cookie}\t${s.csrf}`), ...codes].join("\n") + "\n");
    const recorded = async () => (await db.query<{ n: number }>(`select count(*)::int as n from scans where station = 'bench station'`)).rows[0].n;
    const before = await recorded();
    const out = execFileSync("wrk", ["-t2", "-c10", `-d${seconds}s`, "-s", path.join(here, "scans.lua"), `${base}/api/scans`, "--", input, "2"], { encoding: "utf8", stdio: ["ignore", "pipe", "pipe"] });
    const events = (await recorded()) - before;
    const answers = JSON.parse(out.trim().split("\n").pop()!) as { requests: number; notOk: number; socketErrors: number; ranOut: boolean };
    if (answers.ranOut) throw new Error(`scans: the stations ran out of jobs before the ${seconds} s were over; give them more`);
    // wrk's own check request (see scans.lua) may be one answer without an event
    if (answers.notOk > 0 || answers.socketErrors > 0 || events < answers.requests - 1) {
      throw new Error(`scans: ${answers.requests} answers, ${answers.notOk} not 2xx, ${answers.socketErrors} socket errors, ${events} new events recorded:\n${out}`);
    }
    return Math.min(answers.requests, events) / seconds;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export async function benchShopFloor(seconds = 3, rounds = 3): Promise<BenchRow[]> {
  const url = new URL(process.env.DATABASE_URL!);
  const client = new pg.Client({ connectionString: url.toString() });
  await client.connect();
  const rows: BenchRow[] = [];
  const t0 = Date.now();
  const { firstSeq } = await loadFloor(client);
  rows.push({ name: `load ${JOBS.toLocaleString("en-GB")} jobs and ${SCANS.toLocaleString("en-GB")} scans (generate_series)`, value: Math.round((Date.now() - t0) / 100) / 10, unit: "s" });
  const { rows: [counts] } = await client.query(`select (select count(*) from jobs)::int as jobs, (select count(*) from scans)::int as scans`);
  if (counts.jobs < JOBS || counts.scans < SCANS) throw new Error(`the load made ${counts.jobs} jobs and ${counts.scans} scans`);

  // pgbench's own tables in a database of their own on the same cluster
  await client.query("drop database if exists fluxwright_pgbench");
  await client.query("create database fluxwright_pgbench");
  execFileSync(`${pgbenchBin()}/pgbench`, ["-h", url.hostname, "-p", url.port, "-U", url.username || "postgres", "-i", "-s", "1", "-q", "fluxwright_pgbench"], { stdio: "ignore" });
  await client.query("checkpoint");

  // the floor board's statement, in-process
  const sequelize = new Sequelize(url.toString(), { dialect: "postgres", logging: false });
  const { initModels } = await import("../../server/models");
  initModels(sequelize);
  for (let i = 0; i < 3; i++) await floorBoard(sequelize);
  const boardTimes: number[] = [];
  for (let i = 0; i < 15; i++) {
    const t = process.hrtime.bigint();
    await floorBoard(sequelize);
    boardTimes.push(Number(process.hrtime.bigint() - t) / 1e6);
  }
  const board = median(boardTimes);
  rows.push({ name: "floor board statement (median of 15)", value: Math.round(board * 10) / 10, unit: "ms", target: "<= 100 ms", pass: board <= 100 });
  await sequelize.close();

  const app = await serve("app");
  try {
    const sessions = await Promise.all(Array.from({ length: 10 }, () => signIn(app.url, "operator@demo.test")));
    // warm the lookup's statement on the pool's connections, then measure
    await autocannon({ url: app.url, connections: 10, amount: 200, requests: [{ method: "GET", setupRequest: (req) => ({ ...req, path: `/api/jobs/by-code/J-${firstSeq}`, headers: { cookie: sessions[0].cookie } }) }] });
    // job lookup by code: one station at a time, random jobs of the 100 000
    const lookup = await autocannon({
      url: app.url,
      connections: 1,
      duration: seconds,
      requests: [{ method: "GET", setupRequest: (req) => ({ ...req, path: `/api/jobs/by-code/J-${firstSeq + Math.floor(Math.random() * JOBS)}`, headers: { cookie: sessions[0].cookie } }) }],
    });
    if (lookup.non2xx > 0) throw new Error(`job lookup: ${lookup.non2xx} answers were not 2xx`);
    rows.push({ name: `GET /api/jobs/by-code/:code, one station (${Math.round(lookup.requests.average)} req/s)`, value: lookup.latency.p50, unit: "ms p50" });
    rows.push({ name: "  job lookup by code p99", value: lookup.latency.p99, unit: "ms", target: "<= 10 ms", pass: lookup.latency.p99 <= 10 });

    // scans: the jobs waiting at the blank, each taken once (put back first, on a cluster kept from an earlier run)
    await putBackBenchScans(client);
    const { rows: waiting } = await client.query<{ code: string }>(
      `select j.code from jobs j join lots l on l.id = j.lot_id where l.number like 'LB-%' and j.current_step = 'blank' and j.step_started_at is null and j.completed_at is null order by j.seq`,
    );
    // a share of them for the warm-up and for each round, in proportion to its seconds: six scans a
    // job, so the 12 000 jobs last up to about 3 800 scans/s (a kept cluster with fewer says so)
    const shares = [10, ...Array.from({ length: rounds }, () => seconds)];
    const perSecond = Math.floor(waiting.length / shares.reduce((a, b) => a + b, 0));
    let taken = 0;
    const codes = (secs: number) => waiting.slice(taken, (taken += perSecond * secs)).map((w) => w.code);
    // warm-up, as for quotes (ordering.ts): the figure is that of a server in service, after V8 has
    // optimised the scan's path in every worker (some thousands of scans each), not of processes just
    // started (after 5 s, shared by two workers, the first round still ran a tenth slower)
    await scanRate(app.url, sessions, codes(10), 10, client);
    pgbenchTps(url, 1);
    const ratios: number[] = [];
    const scanRuns: number[] = [];
    const cpuPerScan: number[] = [];
    const pgRuns: number[] = [];
    // alternating, with a pause after each so that one's background work (autovacuum, a
    // checkpoint) settles before the other is measured
    const settle = () => new Promise((r) => setTimeout(r, 1500));
    for (let i = 0; i < rounds; i++) {
      pgRuns.push(pgbenchTps(url, seconds));
      await settle();
      const cpu0 = cpuMs(app.child.pid!);
      scanRuns.push(await scanRate(app.url, sessions, codes(seconds), seconds, client));
      cpuPerScan.push((cpuMs(app.child.pid!) - cpu0) / (scanRuns[i] * seconds));
      await settle();
      ratios.push(scanRuns[i] / pgRuns[i]);
    }
    const ratio = median(ratios);
    // The machine is shared: the load average and each round's pair say how far to trust the ratio;
    // the app's own CPU per scan does not depend on how many other processes want the cores.
    const byRound = pgRuns.map((pgTps, i) => `${Math.round(scanRuns[i])}/${Math.round(pgTps)}`).join(", ");
    rows.push({ name: `POST /api/scans, 10 stations, new events (pgbench -N ${Math.round(median(pgRuns))} tps; scans/pgbench by round ${byRound}; load ${loadavg()[0].toFixed(1)})`, value: Math.round(median(scanRuns)), unit: "req/s" });
    rows.push({ name: "  app process CPU per scan (median of rounds)", value: Number(median(cpuPerScan).toFixed(2)), unit: "ms" });
    rows.push({ name: `  median ratio to pgbench -N (${rounds} rounds)`, value: Number(ratio.toFixed(2)), unit: "×", target: ">= 0.25", pass: ratio >= 0.25 });
  } finally {
    app.child.kill("SIGTERM");
    await client.query("drop database if exists fluxwright_pgbench").catch(() => {});
    await client.end();
  }
  return rows;
}
