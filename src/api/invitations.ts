import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { InvitationCreateInput } from "../../shared/schemas/auth";
import type { InvitationJson } from "../../shared/schemas/people";
import { api } from "./client";

/** GET /api/invitations lists only open ones: not accepted, not replaced, not expired when asked. */
export type Invitation = InvitationJson;

export const invitationKeys = {
  all: ["invitations"] as const,
  list: () => [...invitationKeys.all, "list"] as const,
};

export const invitationsQueryOptions = queryOptions({
  queryKey: invitationKeys.list(),
  queryFn: ({ signal }) => api.get<{ items: Invitation[] }>("/api/invitations", { signal }),
});

/** Still usable now (the list may have been fetched a while ago), soonest expiry first. */
export function pendingInvitations(items: Invitation[], now: Date = new Date()): Invitation[] {
  return items
    .filter((item) => new Date(item.expiresAt).getTime() > now.getTime())
    .sort((a, b) => new Date(a.expiresAt).getTime() - new Date(b.expiresAt).getTime());
}

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InvitationCreateInput) => api.post<Invitation>("/api/invitations", input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationKeys.all }),
  });
}

/** A fresh link and a fresh week for an invitation; the old link stops working. */
export function useResendInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.post<Invitation>(`/api/invitations/${encodeURIComponent(id)}/resend`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationKeys.all }),
  });
}

/** Withdraws an invitation: its link stops working. */
export function useWithdrawInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api.delete<void>(`/api/invitations/${encodeURIComponent(id)}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationKeys.all }),
  });
}
