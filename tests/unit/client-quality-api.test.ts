import { afterEach, describe, expect, it, vi } from "vitest";
import { calibrationForm, certificateUrl, instrumentKeys, instrumentsQueryOptions } from "../../src/api/instruments";
import { samplingKeys, samplingPlanQueryOptions } from "../../src/api/sampling";

afterEach(() => vi.unstubAllGlobals());

function stubFetch(body: unknown) {
  const calls: string[] = [];
  vi.stubGlobal("fetch", async (url: string) => {
    calls.push(url);
    return new Response(JSON.stringify(body), { status: 200, headers: { "content-type": "application/json" } });
  });
  return calls;
}
const run = async (options: { queryFn?: unknown }) => (options.queryFn as (ctx: { signal: AbortSignal }) => Promise<unknown>)({ signal: new AbortController().signal });

describe("the quality API modules", () => {
  it("ask for the sampling plan with the lot size and AQL in the query string", async () => {
    const calls = stubFetch({ codeLetter: "H" });
    expect(await run(samplingPlanQueryOptions(500, 1))).toEqual({ codeLetter: "H" });
    expect(calls).toEqual(["/api/sampling-plan?lotSize=500&aql=1"]);
    expect(samplingPlanQueryOptions(500, 1).queryKey).toEqual([...samplingKeys.plans(), 500, 1]);
  });
  it("list instruments with only the filters given, keyed under one root", async () => {
    const calls = stubFetch([]);
    await run(instrumentsQueryOptions());
    await run(instrumentsQueryOptions({ kind: "search-coil", usable: false }));
    expect(calls).toEqual(["/api/instruments", "/api/instruments?kind=search-coil&usable=false"]);
    expect(instrumentKeys.list({ usable: true }).slice(0, 2)).toEqual([...instrumentKeys.lists()]);
    expect(instrumentKeys.detail("x")).toEqual(["instruments", "detail", "x"]);
    expect(certificateUrl("a b", "c")).toBe("/api/instruments/a%20b/certificates/c");
  });
  it("send a calibration as one form: its dates, the optional fields given, and the file", () => {
    const file = new File(["%PDF-1.4"], "cert.pdf", { type: "application/pdf" });
    const form = calibrationForm({ calibratedOn: "2030-01-02", calibrationDue: "2031-01-02", laboratory: "", certificateNumber: "C-1" }, file);
    expect([...form.keys()]).toEqual(["calibratedOn", "calibrationDue", "certificateNumber", "file"]);
    expect((form.get("file") as File).name).toBe("cert.pdf");
  });
});
