import type { ReactNode } from "react";
import { useQuery } from "@tanstack/react-query";
import { Outlet, useNavigation } from "react-router-dom";
import { meQueryOptions } from "../../api/auth";
import { SiteFooter } from "./site-footer";
import { SiteHeader } from "./site-header";

export function AppLayout({ children }: { children?: ReactNode }) {
  const { data: user } = useQuery(meQueryOptions);
  const navigation = useNavigation();
  const busy = navigation.state !== "idle";

  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="sr-only z-50 rounded-md bg-anneal-600 px-4 py-3 font-semibold text-white focus:not-sr-only focus:fixed focus:left-3 focus:top-3"
      >
        Skip to main content
      </a>
      <SiteHeader user={user ?? null} />
      {/* A thin furnace-coloured bar while the next route's code or data loads. */}
      <div className="h-1 bg-flux-900" aria-hidden="true">
        {busy && <div className="h-1 w-1/3 animate-pulse bg-anneal-400" />}
      </div>
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-page flex-1 px-4 py-8 outline-none sm:px-6" aria-busy={busy}>
        {children ?? <Outlet />}
      </main>
      <SiteFooter />
    </div>
  );
}

/** Shown before the first route's data has arrived. */
export function BootScreen() {
  return (
    <div className="grid min-h-dvh place-items-center bg-nickel-50" role="status">
      <p className="font-display text-h4 text-flux-700">Loading Fluxwright…</p>
    </div>
  );
}
