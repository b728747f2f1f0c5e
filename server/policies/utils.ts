import { AuthorizationError, NotFoundError } from "../errors";
import type { User } from "../models";

export type Actor = Pick<User, "id" | "role" | "organizationId">;

// Small named predicates; policies are built from these so each rule reads as a sentence. Add one
// (isStaff, isOwnOrganization…) with the first policy that needs it.
export const isAdmin = (a: Actor) => a.role === "admin";
export const isStaff = (a: Actor) => a.role !== "customer";
export const isCustomer = (a: Actor) => a.role === "customer";
export const isOwnOrganization = (a: Actor, r: { organizationId?: string | null }) => r.organizationId != null && r.organizationId === a.organizationId;

/** A policy names what an actor may do to a record. `see` decides 404 versus 403. */
export interface Policy<R, A extends string> {
  name: string;
  see(actor: Actor, record: R): boolean;
  can: Record<A, (actor: Actor, record: R) => boolean>;
}

export function definePolicy<R, A extends string>(policy: Policy<R, A>): Policy<R, A> {
  return policy;
}

/** Throws 404 when the actor may not even know the record exists, 403 when they may see but not act. */
export function authorize<R, A extends string>(actor: Actor, action: A, policy: Policy<R, A>, record: R): void {
  if (!policy.see(actor, record)) throw NotFoundError(policy.name);
  if (!policy.can[action](actor, record)) throw AuthorizationError();
}

/** The abilities map presenters attach, so the client hides buttons without re-deriving roles. */
export function abilities<R, A extends string>(actor: Actor | undefined, policy: Policy<R, A>, record: R): Record<A, boolean> {
  const out = {} as Record<A, boolean>;
  for (const action of Object.keys(policy.can) as A[]) out[action] = !!actor && policy.see(actor, record) && policy.can[action](actor, record);
  return out;
}

/** Guards for collection routes (no single record to ask about). */
export function requireRole(actor: Actor, ...allowed: Actor["role"][]): void {
  if (!allowed.includes(actor.role)) throw AuthorizationError();
}
