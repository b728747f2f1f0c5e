import type { QueryClient } from "@tanstack/react-query";
import { useQuery } from "@tanstack/react-query";
import type { LoaderFunctionArgs } from "react-router-dom";
import { meQueryOptions } from "../api/auth";
import { requireUser } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { QueryError } from "../components/query-error";
import { Loading } from "../components/ui/spinner";
import { PageHeader, Panel } from "../components/ui/panel";
import { PasswordForm } from "../features/account/password-form";
import { ProfileForm } from "../features/account/profile-form";

export const makeLoader = (queryClient: QueryClient) => async ({ request }: LoaderFunctionArgs) => {
  await requireUser(queryClient, request);
  return null;
};

export function Component() {
  const me = useQuery(meQueryOptions);
  return (
    <>
      <PageHeader title="Account" lead="Your name as others see it, and your password." />
      <div className="grid gap-6 lg:grid-cols-2">
        <PanelBoundary name="your profile">
          <Panel title="Profile">
            {me.isPending ? (
              <Loading />
            ) : me.isError ? (
              <QueryError error={me.error} onRetry={() => me.refetch()} what="your profile" />
            ) : me.data ? (
              <ProfileForm user={me.data} />
            ) : null}
          </Panel>
        </PanelBoundary>
        <PanelBoundary name="the password form">
          <Panel title="Password">
            <PasswordForm />
          </Panel>
        </PanelBoundary>
      </div>
    </>
  );
}
