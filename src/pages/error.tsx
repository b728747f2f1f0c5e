import { isRouteErrorResponse, useRouteError } from "react-router-dom";
import { ApiError } from "../api/client";
import { paths } from "../config/paths";
import { ProductMark } from "../components/layout/product-mark";
import { SiteFooter } from "../components/layout/site-footer";
import { Button, ButtonLink } from "../components/ui/button";
import { PageHeader } from "../components/ui/panel";
import { StatusNote } from "../components/ui/status-note";
import { NotFoundContent } from "./not-found";

// Loaded eagerly (not lazy): it must render even when a route's code failed to download.

function describe(error: unknown): { status: number | null; title: string; message: string } {
  if (isRouteErrorResponse(error)) {
    if (error.status === 404) return { status: 404, title: "Not found", message: "" };
    if (error.status === 403) return { status: 403, title: "Not for this role", message: "Your role does not give access to this page. Ask the planner if you need it." };
    return { status: error.status, title: "Something went wrong", message: error.statusText };
  }
  if (error instanceof ApiError) return { status: error.status, title: "Something went wrong", message: error.message };
  // A chunk that cannot load usually means a new version was deployed since this tab opened.
  if (error instanceof TypeError && /dynamically imported module|Importing a module script/i.test(error.message)) {
    return { status: null, title: "A newer version is available", message: "Reload the page to continue." };
  }
  return { status: null, title: "Something went wrong", message: "An unexpected error stopped this page. Reloading usually helps." };
}

export function RouteErrorContent() {
  const error = useRouteError();
  const { status, title, message } = describe(error);
  if (status === 404) return <NotFoundContent />;
  return (
    <>
      <PageHeader eyebrow={status ? `Error ${status}` : "Error"} title={title} />
      <div className="max-w-prose space-y-4">
        {message && <StatusNote tone="danger">{message}</StatusNote>}
        <div className="flex flex-wrap gap-3">
          <Button variant="primary" onClick={() => window.location.reload()}>
            Reload
          </Button>
          <ButtonLink to={paths.home.href()}>Go to the home page</ButtonLink>
        </div>
      </div>
    </>
  );
}

/**
 * Outermost errorElement: the layout itself may be what failed, so this draws a plain shell
 * that needs no data.
 */
export function RootErrorPage() {
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="on-dark bg-flux-900 text-white">
        <div className="mx-auto flex max-w-page items-center gap-2.5 px-4 py-2 sm:px-6">
          <a href={paths.home.href()} className="flex min-h-touch items-center gap-2.5 rounded-md text-flux-100">
            <ProductMark />
            <span className="font-display text-h4 font-semibold text-white">Fluxwright</span>
          </a>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-page flex-1 px-4 py-8 sm:px-6">
        <RouteErrorContent />
      </main>
      <SiteFooter />
    </div>
  );
}
