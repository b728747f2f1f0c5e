// The one way the client talks to the server: same-origin cookies, JSON, the CSRF header on
// every state-changing request, and a typed ApiError for every failure.

export type FieldErrors = Record<string, string>;

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: FieldErrors;

  constructor(status: number, code: string, message: string, fields: FieldErrors = {}) {
    super(message);
    this.name = "ApiError";
    this.status = status;
    this.code = code;
    this.fields = fields;
  }

  get isValidation(): boolean {
    return this.status === 400 && Object.keys(this.fields).length > 0;
  }
}

/**
 * Whether a failure is about what the person entered (a 400 naming fields), and so belongs beside
 * the inputs. Anything else (the server failing, the network, a rate limit) is never blamed on them.
 */
export function blamesInputs(error: unknown): error is ApiError {
  return error instanceof ApiError && error.status === 400;
}

const fallbackMessages: Record<number, string> = {
  0: "Could not reach the server. Check the connection and try again.",
  400: "Some of the values were not accepted.",
  401: "Please sign in to continue.",
  403: "You do not have permission to do that.",
  404: "Not found.",
  409: "That conflicts with the current state; reload and try again.",
  429: "Too many attempts. Wait a minute and try again.",
};

/** Turns any error body (ours, a proxy's HTML page, nothing at all) into an ApiError. */
export function toApiError(status: number, body: unknown): ApiError {
  const envelope = isRecord(body) && isRecord(body.error) ? body.error : {};
  const code = typeof envelope.code === "string" && envelope.code ? envelope.code : `HTTP_${status}`;
  const message =
    typeof envelope.message === "string" && envelope.message
      ? envelope.message
      : (fallbackMessages[status] ?? (status >= 500 ? "The server had a problem. Try again shortly." : "The request failed."));
  const fields: FieldErrors = {};
  if (isRecord(envelope.fields)) {
    for (const [path, text] of Object.entries(envelope.fields)) {
      if (typeof text === "string") fields[path] = text;
    }
  }
  return new ApiError(status, code, message, fields);
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

export function isCsrfFailure(error: ApiError): boolean {
  return error.status === 403 && (/csrf/i.test(error.code) || /csrf/i.test(error.message));
}

// --- CSRF token: one per session, cached; reset whenever the session changes. ---
let csrfToken: Promise<string> | null = null;

export function resetCsrfToken(): void {
  csrfToken = null;
}

async function getCsrfToken(): Promise<string> {
  const pending = (csrfToken ??= fetch("/api/auth/csrf", {
    credentials: "same-origin",
    headers: { Accept: "application/json" },
  }).then(async (response) => {
    const body = await readJson(response);
    if (!response.ok) throw toApiError(response.status, body);
    if (!isRecord(body) || typeof body.csrfToken !== "string") throw toApiError(500, null);
    return body.csrfToken;
  }));
  try {
    return await pending;
  } catch (error) {
    if (csrfToken === pending) csrfToken = null; // do not cache a failure
    throw error;
  }
}

// --- 401 handling: the router installs the handler (it owns navigation). ---
let onUnauthorized: ((error: ApiError) => void) | null = null;

export function setUnauthorizedHandler(handler: ((error: ApiError) => void) | null): void {
  onUnauthorized = handler;
}

type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
const mutating = new Set<Method>(["POST", "PUT", "PATCH", "DELETE"]);

export type QueryParams = Record<string, string | number | boolean | null | undefined>;

export interface RequestOptions {
  body?: unknown;
  query?: QueryParams;
  signal?: AbortSignal;
  /** A 401 is an expected answer here (sign-in, "who am I"), not a lost session. */
  anonymousOk?: boolean;
  /**
   * A public computation (prediction, blank): it changes nothing, so it goes without a CSRF token
   * and a visitor who only computes never gets a session row.
   */
  computation?: boolean;
  /** "text": the answer is a file (a DXF drawing), returned as its text instead of parsed JSON. */
  responseType?: "json" | "text";
}

export function buildUrl(path: string, query?: QueryParams): string {
  if (!query) return path;
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== "") search.set(key, String(value));
  }
  const text = search.toString();
  return text ? `${path}${path.includes("?") ? "&" : "?"}${text}` : path;
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text().catch(() => "");
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

async function request<T>(method: Method, path: string, options: RequestOptions = {}, isRetry = false): Promise<T> {
  const headers: Record<string, string> = { Accept: "application/json" };
  // a FormData body (file uploads) sets its own multipart type and boundary
  const form = typeof FormData !== "undefined" && options.body instanceof FormData;
  if (options.body !== undefined && !form) headers["Content-Type"] = "application/json";
  if (mutating.has(method) && !options.computation) headers["X-CSRF-Token"] = await getCsrfToken();

  let response: Response;
  try {
    response = await fetch(buildUrl(path, options.query), {
      method,
      headers,
      body: options.body === undefined ? undefined : form ? (options.body as FormData) : JSON.stringify(options.body),
      credentials: "same-origin",
      signal: options.signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === "AbortError") throw error;
    throw toApiError(0, null);
  }

  if (response.ok && options.responseType === "text") return (await response.text()) as T;
  const body = await readJson(response);
  if (response.ok) return body as T;

  const error = toApiError(response.status, body);
  // A token from before a session change (another tab signed out, the session expired) is
  // refused once; fetch a fresh one and repeat the request a single time.
  if (mutating.has(method) && !isRetry && isCsrfFailure(error)) {
    resetCsrfToken();
    return request<T>(method, path, options, true);
  }
  if (response.status === 401) {
    resetCsrfToken();
    if (!options.anonymousOk) onUnauthorized?.(error);
  }
  throw error;
}

export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, "body">) => request<T>("GET", path, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>("POST", path, { ...options, body }),
  put: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>("PUT", path, { ...options, body }),
  patch: <T>(path: string, body?: unknown, options?: RequestOptions) => request<T>("PATCH", path, { ...options, body }),
  delete: <T>(path: string, options?: RequestOptions) => request<T>("DELETE", path, options),
};
