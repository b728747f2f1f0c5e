import { describe, expect, it } from "vitest";
import { designFiltersFrom, designKeys } from "../../src/api/designs";
import { orderFiltersFrom, orderKeys } from "../../src/api/orders";
import { quoteFiltersFrom, quotePdfUrl } from "../../src/api/quotes";

describe("ordering lists' filters from the URL", () => {
  it("keep what the server accepts and fall back to the defaults for the rest", () => {
    expect(orderFiltersFrom(new URLSearchParams("page=3&status=paid&sort=total&dir=asc&q=%20PO-1%20"))).toEqual({ page: 3, pageSize: 20, status: "paid", sort: "total", dir: "asc", q: "PO-1" });
    expect(orderFiltersFrom(new URLSearchParams("page=-2&status=lost&sort=colour&dir=sideways"))).toEqual({ page: 1, pageSize: 20, status: "", sort: "createdAt", dir: "desc", q: "" });
    expect(quoteFiltersFrom(new URLSearchParams("status=expired")).status).toBe("expired");
    expect(designFiltersFrom(new URLSearchParams("sort=name")).sort).toBe("name");
  });
  it("key every list under its resource, so one invalidation reaches them all", () => {
    const f = orderFiltersFrom(new URLSearchParams());
    expect(orderKeys.list(f).slice(0, 2)).toEqual([...orderKeys.lists()]);
    expect(designKeys.detail("x")).toEqual(["designs", "detail", "x"]);
    expect(quotePdfUrl("a b")).toBe("/api/quotes/a%20b/quote.pdf");
  });
});
