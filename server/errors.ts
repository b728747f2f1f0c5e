// Typed errors with stable codes. Handlers throw these; server/middleware/on-error.ts turns
// them (and zod, body-parser and Sequelize errors) into the one error shape of the API.

export type FieldErrors = Record<string, string>;

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
  ) {
    super(message);
    this.name = "AppError";
  }
}

export const ValidationError = (fields: FieldErrors, message = "Some fields need attention.") =>
  new AppError(400, "VALIDATION_FAILED", message, fields);
export const AuthenticationError = (message = "Sign in to continue.") => new AppError(401, "UNAUTHENTICATED", message);
export const AuthorizationError = (message = "Your role may not do this.") => new AppError(403, "FORBIDDEN", message);
export const NotFoundError = (what = "record") => new AppError(404, "NOT_FOUND", `No such ${what}.`);
export const ConflictError = (code: string, message: string) => new AppError(409, code, message);
/** A single-use link that was spent or has expired: asking again will not help, a new link will. */
export const GoneError = (code: string, message: string, fields?: FieldErrors) => new AppError(410, code, message, fields);
