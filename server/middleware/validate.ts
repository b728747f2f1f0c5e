import type { z } from "zod";
import { ValidationError, type FieldErrors } from "../errors";

/** zod issues → `{ "path.to.field": "what is wrong" }`, first message per field. */
export function fieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join(".") : "body";
    fields[key] ??= issue.message;
  }
  return fields;
}

/** The one validation path: parse untrusted input with a shared schema or throw a 400 naming the fields. */
export function parseInput<S extends z.ZodType>(schema: S, data: unknown): z.output<S> {
  const result = schema.safeParse(data ?? {});
  if (!result.success) throw ValidationError(fieldErrors(result.error));
  return result.data;
}
