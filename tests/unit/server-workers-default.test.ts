import { describe, expect, it } from "vitest";
import { databaseIsLocal, defaultWorkers, loadConfig } from "../../server/config";

// How many worker processes serve requests when WEB_CONCURRENCY is not set: one per core, less the
// core that a PostgreSQL on the same machine needs. Connection-string forms as node-postgres reads
// them (host in the URL, or a socket folder in ?host=).
describe("the default number of server workers", () => {
  it("knows a database on this machine from its URL", () => {
    expect(databaseIsLocal("postgres://postgres@127.0.0.1:54329/fluxwright")).toBe(true);
    expect(databaseIsLocal("postgres://app@localhost/fluxwright")).toBe(true);
    expect(databaseIsLocal("postgres://app@[::1]:5432/fluxwright")).toBe(true);
    expect(databaseIsLocal("postgres://app@/fluxwright?host=/var/run/postgresql")).toBe(true);
    expect(databaseIsLocal("postgres://app@db.internal.example:5432/fluxwright")).toBe(false);
    expect(databaseIsLocal("postgres://app@10.0.0.7/fluxwright")).toBe(false);
    expect(databaseIsLocal("not a url")).toBe(false);
  });

  it("leaves a core to a PostgreSQL beside it, and keeps at least one worker", () => {
    expect(defaultWorkers("postgres://postgres@127.0.0.1/fluxwright", 2)).toBe(1);
    expect(defaultWorkers("postgres://postgres@127.0.0.1/fluxwright", 8)).toBe(7);
    expect(defaultWorkers("postgres://postgres@127.0.0.1/fluxwright", 1)).toBe(1);
    expect(defaultWorkers("postgres://app@db.internal.example/fluxwright", 2)).toBe(2);
  });

  it("runs the workers under a supervising primary unless WEB_CONCURRENCY=1 asks for one process", () => {
    expect(loadConfig({ DATABASE_URL: "postgres://postgres@127.0.0.1/fluxwright" }).supervised).toBe(true);
    expect(loadConfig({ WEB_CONCURRENCY: "3" })).toMatchObject({ workers: 3, supervised: true });
    expect(loadConfig({ WEB_CONCURRENCY: "1" })).toMatchObject({ workers: 1, supervised: false });
  });
});
