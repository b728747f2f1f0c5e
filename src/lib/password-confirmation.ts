import { z } from "zod";

/**
 * Adds the "type it again" field to a form schema. The confirmation lives only in the browser:
 * the server receives the shared schema's fields and never sees it.
 */
export function withPasswordConfirmation<Shape extends z.ZodRawShape>(
  schema: z.ZodObject<Shape>,
  field: Extract<keyof Shape, string>,
  error = "The two passwords are not the same.",
) {
  return schema
    .extend({ confirmPassword: z.string() })
    .refine(
      (values) => {
        const v = values as Record<string, unknown>;
        return v[field] === v.confirmPassword;
      },
      { path: ["confirmPassword"], error },
    );
}
