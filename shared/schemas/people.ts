import type { Role } from "./auth";

// The answers about people, one type each, shared by the server's presenters and the client: a
// field renamed on one side is a type error on the other.

/** A user as every answer shows one (sign-in, session, account, the planner's list); never the password hash. */
export interface UserJson {
  id: string;
  email: string;
  name: string;
  role: Role;
  organizationId: string | null;
  organizationName: string | null;
  createdAt: string;
  /** false once the planner has deactivated the person: they cannot sign in */
  active: boolean;
}

/** GET /api/users/:id/events, one entry of the trail about a person: what changed, who did it, when. */
export interface UserEventJson {
  id: string;
  action: string;
  at: string;
  actor: { id: string; name: string } | null;
  data: Record<string, unknown>;
}

/** GET /api/organizations, one row. */
export interface OrganizationJson {
  id: string;
  name: string;
  kind: "shop" | "customer";
}

/** GET /api/invitations, one open invitation; also the answer of POST /api/invitations (201). */
export interface InvitationJson {
  id: string;
  email: string;
  role: Role;
  organizationId: string | null;
  /** the customer organisation the person joins; null for staff, who join the shop */
  organizationName: string | null;
  expiresAt: string;
  createdAt: string;
}

/** GET /api/auth/invitations/:token: what the invited person sees before accepting. */
export interface InvitationPreviewJson {
  email: string;
  role: Role;
  organizationName: string | null;
  expiresAt: string;
}

/** A page of a list that takes page and pageSize. */
export interface PageJson<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}
