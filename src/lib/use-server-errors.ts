import { useState } from "react";
import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { splitServerErrors } from "./form-errors";

/** Puts a failed request's messages beside the form's fields and the rest above the form. */
export function useServerErrors<T extends FieldValues>(setError: UseFormSetError<T>, fields: readonly Path<T>[]) {
  const [formMessage, setFormMessage] = useState<string | null>(null);
  const show = (error: unknown, overrides?: Partial<Record<number, string>>) => {
    const split = splitServerErrors(error, fields, overrides);
    for (const [field, message] of Object.entries(split.fieldErrors)) {
      setError(field as Path<T>, { type: "server", message: message as string }, { shouldFocus: true });
    }
    setFormMessage(split.formMessage);
  };
  return { formMessage, showServerError: show, clearFormMessage: () => setFormMessage(null) };
}
