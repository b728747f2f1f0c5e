import type { ComponentType } from "react";
import type { QueryClient } from "@tanstack/react-query";
import { createBrowserRouter, redirect, type LoaderFunction, type RouteObject, type ShouldRevalidateFunction } from "react-router-dom";
import { authKeys, meQueryOptions } from "./api/auth";
import { setUnauthorizedHandler } from "./api/client";
import { queryClient } from "./api/query-client";
import { paths } from "./config/paths";
import { AppLayout, BootScreen } from "./components/layout/app-layout";
import { RootErrorPage, RouteErrorContent } from "./pages/error";
// Eager: the error page shows it for a 404 thrown by a loader, so it is in the entry anyway.
import { NotFoundContent } from "./pages/not-found";

/**
 * A lazy page module exports `Component` and, when it needs data before rendering,
 * `makeLoader(queryClient)`: the loader warms the cache with the same query options the
 * component then reads, so the page renders with its data instead of a spinner.
 */
interface PageModule {
  Component: ComponentType;
  makeLoader?: (queryClient: QueryClient) => LoaderFunction;
}

/**
 * Pages that keep their state in the address bar (the design check, the flat blank) change the
 * search on every edit: that is not new data for any loader, so only a new path reloads them.
 */
const samePathKeepsData: ShouldRevalidateFunction = ({ currentUrl, nextUrl, defaultShouldRevalidate }) =>
  currentUrl.pathname === nextUrl.pathname && currentUrl.search !== nextUrl.search ? false : defaultShouldRevalidate;

function page(load: () => Promise<PageModule>): RouteObject["lazy"] {
  return async () => {
    const { Component, makeLoader } = await load();
    return makeLoader ? { Component, loader: makeLoader(queryClient), shouldRevalidate: samePathKeepsData } : { Component };
  };
}

// Who is signed in decides the navigation on every page, so the root resolves it first.
// A failure here (server down) is left to the layout's query, not turned into an error page.
const rootLoader: LoaderFunction = async () => {
  await queryClient.ensureQueryData(meQueryOptions).catch(() => undefined);
  return null;
};

export const routes: RouteObject[] = [
  {
    id: "root",
    path: paths.home.path,
    element: <AppLayout />,
    loader: rootLoader,
    shouldRevalidate: samePathKeepsData,
    errorElement: <RootErrorPage />,
    hydrateFallbackElement: <BootScreen />,
    children: [
      {
        // Errors from a page render inside the layout, so the header stays usable.
        errorElement: <RouteErrorContent />,
        children: [
          { index: true, lazy: page(() => import("./pages/home")) },
          { path: paths.signIn.path, lazy: page(() => import("./pages/sign-in")) },
          { path: paths.register.path, lazy: page(() => import("./pages/register")) },
          { path: paths.forgotPassword.path, lazy: page(() => import("./pages/forgot-password")) },
          { path: paths.resetPassword.path, lazy: page(() => import("./pages/reset-password")) },
          { path: paths.invitation.path, lazy: page(() => import("./pages/invitation")) },
          { path: paths.account.path, lazy: page(() => import("./pages/account")) },
          { path: paths.designCheck.path, lazy: page(() => import("./pages/design-check")) },
          { path: paths.flatBlank.path, lazy: page(() => import("./pages/flat-blank")) },
          { path: paths.findADesign.path, lazy: page(() => import("./pages/find-a-design")) },
          { path: paths.adminShopRates.path, lazy: page(() => import("./pages/admin-shop-rates")) },
          { path: paths.adminMaterials.path, lazy: page(() => import("./pages/admin-materials")) },
          { path: paths.adminUsers.path, lazy: page(() => import("./pages/admin-users")) },
          { path: paths.calibration.path, lazy: page(() => import("./pages/quality-calibration")) },
          { path: paths.controlCharts.path, lazy: page(() => import("./pages/quality-control-charts")) },
          { path: paths.measuredLot.path, lazy: page(() => import("./pages/quality-measured-lot")) },
          { path: paths.designs.path, lazy: page(() => import("./pages/designs")) },
          { path: paths.designCompare.path, lazy: page(() => import("./pages/design-compare")) },
          { path: paths.quotes.path, lazy: page(() => import("./pages/quotes")) },
          { path: paths.quote.path, lazy: page(() => import("./pages/quote")) },
          { path: paths.orderNew.path, lazy: page(() => import("./pages/order-new")) },
          { path: paths.orders.path, lazy: page(() => import("./pages/orders")) },
          { path: paths.order.path, lazy: page(() => import("./pages/order")) },
          { path: paths.floorBoard.path, lazy: page(() => import("./pages/floor-board")) },
          { path: paths.scanStation.path, lazy: page(() => import("./pages/scan-station")) },
          { path: paths.floorJob.path, lazy: page(() => import("./pages/floor-job")) },
          { path: paths.floorLot.path, lazy: page(() => import("./pages/floor-lot")) },
          { path: paths.floorRelease.path, lazy: page(() => import("./pages/floor-release")) },
          { path: paths.furnaceRuns.path, lazy: page(() => import("./pages/furnace-runs")) },
          { path: paths.heats.path, lazy: page(() => import("./pages/heats")) },
          { path: paths.shipping.path, lazy: page(() => import("./pages/shipping")) },
          { path: paths.qualityLots.path, lazy: page(() => import("./pages/quality-lots")) },
          { path: paths.qualityLot.path, lazy: page(() => import("./pages/quality-lot")) },
          { path: paths.quality.path, loader: () => redirect(paths.qualityLots.href()) },
          { path: paths.instruments.path, lazy: page(() => import("./pages/quality-instruments")) },
          { path: paths.instrument.path, lazy: page(() => import("./pages/quality-instrument")) },
          { path: paths.certificates.path, lazy: page(() => import("./pages/certificates")) },
          { path: paths.verify.path, lazy: page(() => import("./pages/verify")) },
          { path: paths.notFound.path, element: <NotFoundContent /> },
        ],
      },
    ],
  },
];

/** Called once from main.tsx; kept out of module scope so the route table can be imported without a browser. */
export function createAppRouter() {
  const router = createBrowserRouter(routes);
  // A 401 on a protected call means the session ended: forget the user and go to sign-in,
  // keeping the page they were on so sign-in can bring them back.
  setUnauthorizedHandler(() => {
    queryClient.setQueryData(authKeys.me, null);
    const { pathname, search } = router.state.location;
    if (pathname !== paths.signIn.path) {
      void router.navigate(paths.signIn.href(pathname + search), { replace: true });
    }
  });
  return router;
}
