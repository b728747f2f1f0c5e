import { queryOptions, useMutation, useQueryClient, type QueryClient } from "@tanstack/react-query";
import type {
  InvitationAcceptInput,
  LoginInput,
  PasswordChangeInput,
  PasswordResetConfirmInput,
  PasswordResetRequestInput,
  ProfileInput,
  RegisterInput,
  Role,
} from "../../shared/schemas/auth";
import type { InvitationPreviewJson, UserJson } from "../../shared/schemas/people";
import { api, resetCsrfToken } from "./client";

export type { Role };
export type User = UserJson;
export type InvitationPreview = InvitationPreviewJson;

export const authKeys = {
  all: ["auth"] as const,
  me: ["auth", "me"] as const,
  invitation: (token: string) => ["auth", "invitation", token] as const,
  resetLink: (token: string) => ["auth", "reset-link", token] as const,
};

/** The signed-in user, or null when nobody is signed in (a 401 is an answer, not an error). */
export const meQueryOptions = queryOptions({
  queryKey: authKeys.me,
  // /api/auth/session answers 200 with user null when signed out, so a visitor's console shows no 401.
  queryFn: async ({ signal }): Promise<User | null> => {
    const { user } = await api.get<{ user: User | null }>("/api/auth/session", { signal, anonymousOk: true });
    return user;
  },
  staleTime: 5 * 60_000,
});

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: authKeys.invitation(token),
    queryFn: ({ signal }) =>
      api.get<InvitationPreview>(`/api/auth/invitations/${encodeURIComponent(token)}`, { signal, anonymousOk: true }),
    staleTime: Infinity,
    // A 404 from the loader is the answer (expired or used), not something to fetch again.
    retryOnMount: false,
  });

/** Whether a password-reset link still works (404 when it has expired or was used), asked before the form is shown. */
export const resetLinkQueryOptions = (token: string) =>
  queryOptions({
    queryKey: authKeys.resetLink(token),
    queryFn: ({ signal }) => api.get<{ expiresAt: string }>(`/api/auth/password-reset/${encodeURIComponent(token)}`, { signal, anonymousOk: true }),
    staleTime: 60_000,
    retryOnMount: false,
  });

/**
 * After sign-in, registration, invitation accept and sign-out the server binds a new CSRF token
 * to the new session, and anything cached belongs to the previous user.
 */
export function applySessionChange(queryClient: QueryClient, user: User | null): void {
  resetCsrfToken();
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
  queryClient.setQueryData(authKeys.me, user);
}

export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: LoginInput) => api.post<{ user: User }>("/api/auth/login", input, { anonymousOk: true }),
    onSuccess: ({ user }) => applySessionChange(queryClient, user),
  });
}

/**
 * Registers, then asks who is signed in: the answer to a registration looks the same whether or
 * not the address already had an account (the server does not tell), and only the session says
 * whether this browser is now signed in. `user` null: nobody is, and a mail has gone to the address.
 */
export function useRegister() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: RegisterInput): Promise<{ user: User | null; email: string }> => {
      await api.post<{ user: User }>("/api/auth/register", input, { anonymousOk: true });
      resetCsrfToken();
      const { user } = await api.get<{ user: User | null }>("/api/auth/session", { anonymousOk: true });
      return { user, email: input.email };
    },
    onSuccess: ({ user }) => applySessionChange(queryClient, user),
  });
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InvitationAcceptInput) =>
      api.post<{ user: User }>("/api/auth/invitations/accept", input, { anonymousOk: true }),
    onSuccess: ({ user }) => applySessionChange(queryClient, user),
  });
}

export function useLogout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<void>("/api/auth/logout", undefined, { anonymousOk: true }),
    // Signed out locally even if the server call failed: the user asked to leave.
    onSettled: () => applySessionChange(queryClient, null),
  });
}

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (input: PasswordResetRequestInput) =>
      api.post<void>("/api/auth/password-reset/request", input, { anonymousOk: true }),
  });
}

export function useConfirmPasswordReset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PasswordResetConfirmInput) =>
      api.post<void>("/api/auth/password-reset/confirm", input, { anonymousOk: true }),
    // The server signs the account out everywhere on a reset, this browser included.
    onSuccess: () => applySessionChange(queryClient, null),
  });
}

export function useUpdateProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ProfileInput) => api.patch<{ user: User }>("/api/auth/me", input),
    onSuccess: ({ user }) => queryClient.setQueryData(authKeys.me, user),
  });
}

export function useChangePassword() {
  return useMutation({
    mutationFn: (input: PasswordChangeInput) => api.post<void>("/api/auth/password", input),
    // Servers commonly rotate the session on a password change; a fresh token costs one request.
    onSuccess: () => resetCsrfToken(),
  });
}
