import { describe, it, expect } from "vitest";
describe("runner", () => { it("runs", () => { expect(1 + 1).toBe(2); }); });
