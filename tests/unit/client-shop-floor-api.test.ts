import { describe, expect, it } from "vitest";
import { FLOOR_REFRESH_MS, floorBoardQueryOptions, floorKeys } from "../../src/api/floor";
import { furnaceRunFiltersFrom, furnaceRunKeys } from "../../src/api/furnace-runs";
import { heatFiltersFrom } from "../../src/api/heats";
import { jobByCodeQueryOptions, jobFiltersFrom, jobKeys, lotFiltersFrom, lotKeys, travelerPdfUrl } from "../../src/api/jobs";
import { newScanKey } from "../../src/api/scans";
import { IDEMPOTENCY_KEY } from "../../shared/schemas/scans";

describe("shop-floor lists' filters from the URL", () => {
  it("keep what the server accepts and fall back to the defaults for the rest", () => {
    const id = "9b6f3c5e-0000-4000-8000-000000000000";
    expect(jobFiltersFrom(new URLSearchParams(`step=form&status=on_hold&late=true&lotId=${id}&orderId=7&sort=code&q=%20j-12%20`))).toEqual({
      page: 1, pageSize: 20, q: "j-12", step: "form", status: "on_hold", late: "true", lotId: id, orderId: "", sort: "code", dir: "asc",
    });
    expect(jobFiltersFrom(new URLSearchParams("step=paint&status=lost&late=maybe&sort=colour"))).toMatchObject({ step: "", status: "", late: "", sort: "dueDate" });
    expect(lotFiltersFrom(new URLSearchParams("status=ready_for_anneal")).status).toBe("ready_for_anneal");
    expect(lotFiltersFrom(new URLSearchParams("status=gone")).status).toBe("");
    expect(furnaceRunFiltersFrom(new URLSearchParams("withinWindow=false")).withinWindow).toBe("false");
    expect(heatFiltersFrom(new URLSearchParams("sort=heatNumber&dir=asc"))).toMatchObject({ sort: "heatNumber", dir: "asc" });
  });

  it("key every list under its resource; the lookup by code forgives the scanner's case and spaces", () => {
    expect(jobKeys.list(jobFiltersFrom(new URLSearchParams())).slice(0, 2)).toEqual([...jobKeys.lists()]);
    expect(jobKeys.byCode(" j-1042 ")).toEqual(["jobs", "code", "J-1042"]);
    expect(jobByCodeQueryOptions("").enabled).toBe(false);
    expect(lotKeys.detail("x")).toEqual(["lots", "detail", "x"]);
    expect(furnaceRunKeys.furnaces()).toEqual(["furnace-runs", "furnaces"]);
    expect(travelerPdfUrl("a b", "LETTER")).toBe("/api/jobs/a%20b/traveler.pdf?paper=LETTER");
  });

  it("the board refreshes by itself; each scan gets its own key, one the server accepts", () => {
    expect(floorBoardQueryOptions().refetchInterval).toBe(FLOOR_REFRESH_MS);
    expect(floorBoardQueryOptions().queryKey).toEqual([...floorKeys.board()]);
    const a = newScanKey("Press 2 / tablet");
    const b = newScanKey("Press 2 / tablet");
    expect(a).not.toBe(b);
    expect(a).toMatch(IDEMPOTENCY_KEY);
    expect(a.startsWith("Press-2---tablet:")).toBe(true);
  });
});
