import type { z } from "zod";
import { issueFields } from "../../shared/schemas/messages";
import { NotFoundError, ValidationError, type FieldErrors } from "../errors";

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

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** A record id from the path: anything that is not a UUID names no record (404, never a database error). */
export function recordId(value: unknown, what: string): string {
  if (typeof value !== "string" || !UUID.test(value)) throw NotFoundError(what);
  return value.toLowerCase();
}

/** A search text as an ILIKE pattern that matches it literally anywhere. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
