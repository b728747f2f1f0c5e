// Every client path lives here: routes read `.path`, links call `.href(...)`, so a renamed path
// changes in one place.

const encode = encodeURIComponent;

/** The flat-blank page's inputs that a link may fill in (mm; kind: box-bent, cylinder-drawn, cylinder-rolled). */
export const flatBlankPrefillKeys = [
  "kind", "width", "depth", "height", "diameter", "length", "thickness", "bendRadius", "kFactor", "cornerRadius", "trim", "seamOverlap", "material",
] as const;
export type FlatBlankPrefill = Partial<Record<(typeof flatBlankPrefillKeys)[number], string>>;

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
  designCheck: { path: "/design-check", href: () => "/design-check" },
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
  qualityLots: { path: "/quality/lots", href: (stage?: string) => (stage && stage !== "to-measure" ? `/quality/lots?stage=${encode(stage)}` : "/quality/lots") },
  qualityLot: { path: "/quality/lots/:id", href: (id: string) => `/quality/lots/${encode(id)}` },
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
