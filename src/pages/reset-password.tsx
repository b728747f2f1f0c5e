import type { QueryClient } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { resetLinkQueryOptions } from "../api/auth";
import { PanelBoundary } from "../components/error-boundary";
import { AuthCard } from "../features/auth/auth-card";
import { ResetPasswordForm } from "../features/auth/reset-password-form";
import { warm } from "../lib/guards";

// The link is checked before the page shows: a spent or expired one says so instead of a form.
export const makeLoader = (queryClient: QueryClient) => async ({ params }: LoaderFunctionArgs) => {
  await warm(queryClient.ensureQueryData(resetLinkQueryOptions(params.token ?? "")));
  return null;
};

export function Component() {
  const { token = "" } = useParams();
  return (
    <AuthCard title="Choose a new password">
      <PanelBoundary name="the new password form">
        <ResetPasswordForm token={token} />
      </PanelBoundary>
    </AuthCard>
  );
}
