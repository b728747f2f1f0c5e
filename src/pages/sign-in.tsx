import type { QueryClient } from "@tanstack/react-query";
import { Link, redirect, useSearchParams, type LoaderFunctionArgs } from "react-router-dom";
import { meQueryOptions } from "../api/auth";
import { paths, safeRedirect } from "../config/paths";
import { PanelBoundary } from "../components/error-boundary";
import { StatusNote } from "../components/ui/status-note";
import { AuthCard } from "../features/auth/auth-card";
import { SignInForm } from "../features/auth/sign-in-form";

// Someone already signed in goes straight to where they were heading.
export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  const user = await queryClient.ensureQueryData(meQueryOptions).catch(() => null);
  const target = safeRedirect(new URL(request.url).searchParams.get("redirectTo"));
  if (user) throw redirect(target ?? paths.home.href());
  return null;
};

export function Component() {
  const [searchParams] = useSearchParams();
  const redirectTo = safeRedirect(searchParams.get("redirectTo"));
  return (
    <AuthCard
      title="Sign in"
      lead="Customers, shop staff and quality use the same sign-in."
      footer={
        <p>
          New customer?{" "}
          <Link to={paths.register.href()} className="font-semibold text-flux-800 underline underline-offset-4">
            Create an account
          </Link>
          . Staff accounts come by invitation from the planner.
        </p>
      }
    >
      {redirectTo && (
        <StatusNote tone="info" className="mb-5">
          Sign in to continue to that page.
        </StatusNote>
      )}
      <PanelBoundary name="the sign-in form">
        <SignInForm redirectTo={redirectTo} />
      </PanelBoundary>
    </AuthCard>
  );
}
