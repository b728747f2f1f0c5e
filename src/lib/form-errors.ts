import { ApiError } from "../api/client";

export interface ServerErrorSplit<K extends string> {
  fieldErrors: Partial<Record<K, string>>;
  formMessage: string | null;
}

/**
 * Splits a failed request into messages for the form's own fields (shown beside them) and one
 * message for the form as a whole (anything else, including fields the form does not have).
 * `overrides` gives the form its own wording for particular statuses (401 on sign-in, 404 …).
 */
export function splitServerErrors<K extends string>(
  error: unknown,
  formFields: readonly K[],
  overrides: Partial<Record<number, string>> = {},
): ServerErrorSplit<K> {
  if (!(error instanceof ApiError)) {
    return { fieldErrors: {}, formMessage: "Something went wrong. Try again." };
  }
  const fieldErrors: Partial<Record<K, string>> = {};
  const strays: string[] = [];
  for (const [path, message] of Object.entries(error.fields)) {
    const field = formFields.find((name) => name === path || path.startsWith(`${name}.`));
    if (field && !fieldErrors[field]) fieldErrors[field] = message;
    else strays.push(message);
  }
  const override = overrides[error.status];
  let formMessage: string | null = override ?? null;
  if (!formMessage && strays.length > 0) formMessage = strays.join(" ");
  if (!formMessage && Object.keys(fieldErrors).length === 0) formMessage = error.message;
  return { fieldErrors, formMessage };
}
