// Every client path lives here: routes read `.path`, links call `.href(...)`, so a renamed path
// changes in one place.

const encode = encodeURIComponent;

/** The flat-blank page's inputs that a link may fill in (mm; kind: box-bent, cylinder-drawn, cylinder-rolled). */
export const flatBlankPrefillKeys = [
  "kind", "width", "depth", "height", "diameter", "length", "thickness", "bendRadius", "kFactor", "cornerRadius", "trim", "seamOverlap", "material",
] as const;
export type FlatBlankPrefill = Partial<Record<(typeof flatBlankPrefillKeys)[number], string>>;

/** A list page's state in its address: search, filter, sort and page (defaults left out). */
export interface ListFilters {
  q?: string;
  status?: string;
  sort?: string;
  dir?: "asc" | "desc";
  page?: number;
}
function withList(path: string, f?: ListFilters): string {
  const search = new URLSearchParams();
  if (f?.q) search.set("q", f.q);
  if (f?.status) search.set("status", f.status);
  if (f?.sort) search.set("sort", f.sort);
  if (f?.dir) search.set("dir", f.dir);
  if (f?.page && f.page > 1) search.set("page", String(f.page));
  const query = search.toString();
  return query ? `${path}?${query}` : path;
}

export const paths = {
  home: { path: "/", href: () => "/" },
  signIn: {
    path: "/sign-in",
    // redirectTo is where the user was going; sign-in sends them back there afterwards.
    href: (redirectTo?: string | null) =>
      redirectTo && redirectTo !== "/" ? `/sign-in?redirectTo=${encode(redirectTo)}` : "/sign-in",
  },
  register: { path: "/register", href: () => "/register" },
  forgotPassword: { path: "/forgot-password", href: () => "/forgot-password" },
  resetPassword: { path: "/reset-password/:token", href: (token: string) => `/reset-password/${encode(token)}` },
  invitation: { path: "/invitation/:token", href: (token: string) => `/invitation/${encode(token)}` },
  account: { path: "/account", href: () => "/account" },
  designCheck: {
    path: "/design-check",
    // a design's parameters (design-url.ts) open the check with that design filled in
    href: (design?: URLSearchParams) => (design && design.size ? `/design-check?${design.toString()}` : "/design-check"),
  },
  findADesign: { path: "/find-a-design", href: () => "/find-a-design" },
  flatBlank: {
    path: "/flat-blank",
    // a prefill opens the calculator with these inputs (the design check links each part here)
    href: (prefill?: FlatBlankPrefill) => {
      const search = new URLSearchParams();
      for (const key of flatBlankPrefillKeys) {
        const value = prefill?.[key];
        if (value !== undefined && value !== "") search.set(key, value);
      }
      const query = search.toString();
      return query ? `/flat-blank?${query}` : "/flat-blank";
    },
  },
  adminShopRates: { path: "/admin/shop-rates", href: () => "/admin/shop-rates" },
  adminMaterials: { path: "/admin/materials", href: () => "/admin/materials" },
  adminUsers: {
    path: "/admin/users",
    href: (filters?: { page?: number; q?: string }) => {
      const search = new URLSearchParams();
      if (filters?.q) search.set("q", filters.q);
      if (filters?.page && filters.page > 1) search.set("page", String(filters.page));
      const query = search.toString();
      return query ? `/admin/users?${query}` : "/admin/users";
    },
  },
  calibration: { path: "/quality/calibration", href: () => "/quality/calibration" },
  controlCharts: { path: "/quality/control-charts", href: () => "/quality/control-charts" },
  measuredLot: { path: "/quality/measured-lots/:lotId", href: (lotId: string) => `/quality/measured-lots/${encode(lotId)}` },
  designs: { path: "/designs", href: (filters?: ListFilters) => withList("/designs", filters) },
  designCompare: { path: "/designs/compare", href: (ids: readonly string[]) => `/designs/compare?ids=${ids.map(encode).join(",")}` },
  quotes: { path: "/quotes", href: (filters?: ListFilters & { status?: string }) => withList("/quotes", filters) },
  quote: { path: "/quotes/:id", href: (id: string) => `/quotes/${encode(id)}` },
  orderNew: { path: "/quotes/:id/order", href: (quoteId: string) => `/quotes/${encode(quoteId)}/order` },
  orders: { path: "/orders", href: (filters?: ListFilters & { status?: string }) => withList("/orders", filters) },
  order: { path: "/orders/:id", href: (id: string) => `/orders/${encode(id)}` },
  // the shop floor
  floorBoard: { path: "/floor", href: (search?: string) => (search ? `/floor?${search}` : "/floor") },
  scanStation: { path: "/floor/scan", href: () => "/floor/scan" },
  floorJob: { path: "/floor/jobs/:id", href: (id: string) => `/floor/jobs/${encode(id)}` },
  floorLot: { path: "/floor/lots/:id", href: (id: string) => `/floor/lots/${encode(id)}` },
  floorRelease: { path: "/floor/release", href: () => "/floor/release" },
  furnaceRuns: { path: "/floor/furnace", href: () => "/floor/furnace" },
  heats: { path: "/floor/heats", href: () => "/floor/heats" },
  shipping: { path: "/floor/shipping", href: () => "/floor/shipping" },
  qualityLots: { path: "/quality/lots", href: (stage?: string) => (stage && stage !== "to-measure" ? `/quality/lots?stage=${encode(stage)}` : "/quality/lots") },
  qualityLot: { path: "/quality/lots/:id", href: (id: string) => `/quality/lots/${encode(id)}` },
  // the quality pages as one place (the planner's menu has one link to them)
  quality: { path: "/quality", href: () => "/quality" },
  instruments: {
    path: "/quality/instruments",
    href: (filters?: { kind?: string; usable?: boolean }) => {
      const search = new URLSearchParams();
      if (filters?.kind) search.set("kind", filters.kind);
      if (filters?.usable) search.set("usable", "true");
      const query = search.toString();
      return query ? `/quality/instruments?${query}` : "/quality/instruments";
    },
  },
  instrument: { path: "/quality/instruments/:id", href: (id: string) => `/quality/instruments/${encode(id)}` },
  certificates: { path: "/certificates", href: () => "/certificates" },
  verify: { path: "/verify/:digest?", href: (digest?: string) => (digest ? `/verify/${encode(digest)}` : "/verify") },
  notFound: { path: "*", href: () => "/not-found" },
} as const;

/**
 * Accepts only a same-origin path for the post-sign-in redirect, so a crafted link cannot send a
 * freshly signed-in user to another site ("//evil.example", "https://…", "/\\evil").
 */
export function safeRedirect(target: string | null | undefined, fallback: string | null = null): string | null {
  if (!target || !target.startsWith("/") || target.startsWith("//") || target.startsWith("/\\")) return fallback;
  if (target.startsWith(paths.signIn.path)) return fallback;
  return target;
}
