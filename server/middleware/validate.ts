import type { z } from "zod";
import { issueFields } from "../../shared/schemas/messages";
import { ValidationError, type FieldErrors } from "../errors";

/** zod issues → `{ "path.to.field": "what is wrong" }`, first message per field, in the words of the shared error map. */
export function fieldErrors(error: z.ZodError): FieldErrors {
  return issueFields(error);
}

/** The one validation path: parse untrusted input with a shared schema or throw a 400 naming the fields. */
export function parseInput<S extends z.ZodType>(schema: S, data: unknown): z.output<S> {
  const result = schema.safeParse(data ?? {});
  if (!result.success) throw ValidationError(fieldErrors(result.error));
  return result.data;
}
