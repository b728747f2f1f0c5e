import { queryOptions, useMutation, useQueryClient } from "@tanstack/react-query";
import type { InvitationCreateInput, Role } from "../../shared/schemas/auth";
import { api } from "./client";

export interface Invitation {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
  organizationName?: string | null;
  acceptedAt?: string | null;
}

export const invitationKeys = {
  all: ["invitations"] as const,
  list: () => [...invitationKeys.all, "list"] as const,
};

export const invitationsQueryOptions = queryOptions({
  queryKey: invitationKeys.list(),
  queryFn: ({ signal }) => api.get<{ items: Invitation[] }>("/api/invitations", { signal }),
});

/** Pending: not accepted and not yet expired, soonest expiry first. */
export function pendingInvitations(items: Invitation[], now: Date = new Date()): Invitation[] {
  return items
    .filter((item) => !item.acceptedAt && new Date(item.expiresAt).getTime() > now.getTime())
    .sort((a, b) => new Date(a.expiresAt).getTime() - new Date(b.expiresAt).getTime());
}

export function useCreateInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InvitationCreateInput) => api.post<Invitation>("/api/invitations", input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationKeys.all }),
  });
}
