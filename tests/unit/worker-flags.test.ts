import { describe, expect, it } from "vitest";
import { workerExecArgv, YOUNG_GENERATION_FLAG } from "../../server/cluster";

// The node flags the primary hands its workers (server/cluster.ts). The flag's spelling is Node's
// own (`node --help`: "--max-semi-space-size=... max size of a semi-space (in MiB)").
describe("a server worker's node flags", () => {
  it("keeps the primary's own flags and adds the young generation's size", () => {
    expect(YOUNG_GENERATION_FLAG).toBe("--max-semi-space-size=32");
    expect(workerExecArgv(["--import", "tsx"])).toEqual(["--import", "tsx", YOUNG_GENERATION_FLAG]);
    expect(workerExecArgv([])).toEqual([YOUNG_GENERATION_FLAG]);
  });

  it("leaves a size given to node itself or in NODE_OPTIONS alone", () => {
    expect(workerExecArgv(["--max-semi-space-size=64"])).toEqual(["--max-semi-space-size=64"]);
    expect(workerExecArgv(["--max_semi_space_size=8"])).toEqual(["--max_semi_space_size=8"]);
    expect(workerExecArgv([], "--enable-source-maps --max-semi-space-size=16")).toEqual([]);
  });

  it("is not fooled by a flag that only starts alike", () => {
    expect(workerExecArgv([], "--max-old-space-size=4096")).toEqual([YOUNG_GENERATION_FLAG]);
  });
});
