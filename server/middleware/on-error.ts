import type { ErrorRequestHandler, RequestHandler } from "express";
import { BaseError, EmptyResultError, UniqueConstraintError, ValidationError as SequelizeValidationError } from "sequelize";
import { ZodError } from "zod";
import { AppError } from "../errors";
import { fieldErrors } from "./validate";

function toAppError(err: unknown): AppError | undefined {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return new AppError(400, "VALIDATION_FAILED", "Some fields need attention.", fieldErrors(err));
  const e = err as { type?: string; status?: number; code?: string };
  if (e?.type === "entity.parse.failed") return new AppError(400, "MALFORMED_JSON", "The request body is not valid JSON.");
  if (e?.type === "entity.too.large") return new AppError(413, "PAYLOAD_TOO_LARGE", "The request body is too large.");
  if (e?.type === "encoding.unsupported" || e?.type === "charset.unsupported") return new AppError(415, "UNSUPPORTED_ENCODING", "Send UTF-8 JSON.");
  if (e?.code === "EBADCSRFTOKEN") return new AppError(403, "CSRF_INVALID", "The form's security token is missing or stale; reload and try again.");
  if (err instanceof UniqueConstraintError) {
    const fields = Object.fromEntries(err.errors.map((x) => [x.path ?? "body", "This value is already taken."]));
    return new AppError(409, "ALREADY_EXISTS", "A record with these values already exists.", fields);
  }
  if (err instanceof SequelizeValidationError) {
    const fields = Object.fromEntries(err.errors.map((x) => [x.path ?? "body", x.message]));
    return new AppError(400, "VALIDATION_FAILED", "Some fields need attention.", fields);
  }
  if (err instanceof EmptyResultError) return new AppError(404, "NOT_FOUND", "No such record.");
  if (err instanceof BaseError && /ECONNREFUSED|connect|ConnectionError/i.test(err.name + err.message)) {
    return new AppError(503, "DATABASE_UNAVAILABLE", "The database is not answering; try again shortly.");
  }
  if (typeof e?.status === "number" && e.status >= 400 && e.status < 500) return new AppError(e.status, "BAD_REQUEST", "The request could not be read.");
  return undefined;
}

/** The one error middleware: known errors become the contract's shape, unknown ones a logged 500. */
export const onError: ErrorRequestHandler = (err, req, res, _next) => {
  const known = toAppError(err);
  if (!known) {
    req.log?.error({ err }, "unhandled error");
    res.status(500).json({ error: { code: "INTERNAL", message: "Something went wrong on our side; it has been logged." } });
    return;
  }
  if (known.status >= 500) req.log?.warn({ err }, known.code);
  const body: { code: string; message: string; fields?: Record<string, string> } = { code: known.code, message: known.message };
  if (known.fields) body.fields = known.fields;
  res.status(known.status).json({ error: body });
};

export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: { code: "NOT_FOUND", message: `No API route ${req.method} ${req.path}.` } });
};
