import type { QueryClient } from "@tanstack/react-query";
import { useParams, type LoaderFunctionArgs } from "react-router-dom";
import { invitationQueryOptions } from "../api/auth";
import { warm } from "../lib/guards";
import { PanelBoundary } from "../components/error-boundary";
import { AuthCard } from "../features/auth/auth-card";
import { InvitationAccept } from "../features/auth/invitation-accept";

export const makeLoader = (queryClient: QueryClient) => async ({ params }: LoaderFunctionArgs) => {
  await warm(queryClient.ensureQueryData(invitationQueryOptions(params.token ?? "")));
  return null;
};

export function Component() {
  const { token = "" } = useParams();
  return (
    <AuthCard title="Accept your invitation" lead="Choose the name colleagues will see and a password.">
      <PanelBoundary name="the invitation">
        <InvitationAccept token={token} />
      </PanelBoundary>
    </AuthCard>
  );
}
