import { z } from "zod";
import "./messages"; // the one error map: every field named in plain words

// Request bodies for sign-in, accounts and invitations. The server validates with these
// schemas and the client forms use the same ones, so a message shown beside a field is the
// message the server would have sent.

export const roles = ["customer", "operator", "qa", "admin"] as const;
export const roleSchema = z.enum(roles, { error: "Choose a role." });
export type Role = z.infer<typeof roleSchema>;

// Trim and lower-case before the format check so " Ada@Shop.Test " is accepted and stored once.
const email = z
  .string({ error: "Enter an email address." })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: "Enter a valid email address." }).max(254, { error: "Email address is too long." }));

export const passwordSchema = z
  .string({ error: "Enter a password." })
  .min(10, { error: "Use at least 10 characters." })
  .max(200, { error: "Use at most 200 characters." });

const personName = z
  .string({ error: "Enter your name." })
  .trim()
  .min(1, { error: "Enter your name." })
  .max(120, { error: "Use at most 120 characters." });

const token = z.string().trim().min(1, { error: "The link is missing its token." }).max(512);

export const loginSchema = z.object({
  email,
  // Sign-in checks only presence: a length rule here would reveal the password policy to guessers
  // and lock out accounts created before a policy change.
  password: z.string({ error: "Enter your password." }).min(1, { error: "Enter your password." }).max(200),
});

export const registerSchema = z.object({
  email,
  password: passwordSchema,
  name: personName,
  organization: z
    .string({ error: "Enter your organisation." })
    .trim()
    .min(1, { error: "Enter your organisation." })
    .max(160, { error: "Use at most 160 characters." }),
});

export const invitationAcceptSchema = z.object({
  token,
  name: personName,
  password: passwordSchema,
});

export const passwordResetRequestSchema = z.object({ email });

export const passwordResetConfirmSchema = z.object({
  token,
  password: passwordSchema,
});

export const profileSchema = z.object({ name: personName });

export const passwordChangeSchema = z.object({
  currentPassword: z
    .string({ error: "Enter your current password." })
    .min(1, { error: "Enter your current password." })
    .max(200),
  newPassword: passwordSchema,
});

export const invitationCreateSchema = z.object({
  email,
  role: roleSchema,
  organizationId: z.uuid({ error: "Choose an organisation." }).optional(),
});

/** PATCH /api/users/:id: the planner changes a role, or deactivates or reactivates a person. */
export const userAccessUpdateSchema = z
  .object({
    role: roleSchema.optional(),
    active: z.boolean({ error: "Active must be true or false." }).optional(),
  })
  .refine((v) => v.role !== undefined || v.active !== undefined, { error: "Give a new role or whether the person is active.", path: ["role"] });

export type LoginInput = z.infer<typeof loginSchema>;
export type RegisterInput = z.infer<typeof registerSchema>;
export type InvitationAcceptInput = z.infer<typeof invitationAcceptSchema>;
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestSchema>;
export type PasswordResetConfirmInput = z.infer<typeof passwordResetConfirmSchema>;
export type ProfileInput = z.infer<typeof profileSchema>;
export type PasswordChangeInput = z.infer<typeof passwordChangeSchema>;
export type InvitationCreateInput = z.infer<typeof invitationCreateSchema>;
export type UserAccessUpdate = z.infer<typeof userAccessUpdateSchema>;
