import { describe, expect, it } from "vitest";
import { defaultPoolMax } from "../../server/db/sequelize";

// The PostgreSQL wiki's rule of thumb for a connection pool, "connections = ((core_count * 2) +
// effective_spindle_count)" (page "Number Of Database Connections"; quoted from memory), taken with
// one spindle and shared among the server's worker processes.
describe("the database pool of one server process", () => {
  it("is twice the cores and one for a single process", () => {
    expect(defaultPoolMax(1, 2)).toBe(5);
    expect(defaultPoolMax(1, 8)).toBe(17);
  });

  it("is each worker's share, rounded up, when the cores' processes share the rule's total", () => {
    expect(defaultPoolMax(2, 2)).toBe(3);
    expect(defaultPoolMax(4, 4)).toBe(3);
    expect(defaultPoolMax(3, 8)).toBe(6);
  });

  it("never falls below two connections (a transaction and a read beside it)", () => {
    expect(defaultPoolMax(8, 2)).toBe(2);
  });
});
