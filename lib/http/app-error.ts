// One application error type with codes; the guard maps it to an HTTP status and a clear message.
export type AppErrorCode =
  | "unauthenticated"
  | "forbidden"
  | "not_found"
  | "invalid_input"
  | "conflict"
  | "rate_limited"
  | "payload_too_large"
  | "unsupported_media";

const STATUS: Record<AppErrorCode, number> = {
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  invalid_input: 422,
  conflict: 409,
  rate_limited: 429,
  payload_too_large: 413,
  unsupported_media: 415,
};

export class AppError extends Error {
  readonly code: AppErrorCode;
  readonly fieldErrors?: Record<string, string[]>;
  /** Extra data for the client, e.g. the server's copy of a record on a version conflict. */
  readonly details?: Record<string, unknown>;

  constructor(
    code: AppErrorCode,
    message: string,
    fieldErrors?: Record<string, string[]>,
    details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.fieldErrors = fieldErrors;
    this.details = details;
  }

  get status(): number {
    return STATUS[this.code];
  }
}

export const notFound = (what = "That record") =>
  new AppError("not_found", `${what} was not found.`);

export interface ErrorBody {
  error: {
    code: AppErrorCode | "internal";
    message: string;
    fieldErrors?: Record<string, string[]>;
    details?: Record<string, unknown>;
  };
}

/** Turns anything thrown into a status and a body safe to show: no stack, no SQL. */
export function toErrorBody(err: unknown): { status: number; body: ErrorBody } {
  if (err instanceof AppError) {
    const error: ErrorBody["error"] = { code: err.code, message: err.message };
    if (err.fieldErrors) error.fieldErrors = err.fieldErrors;
    if (err.details) error.details = err.details;
    return { status: err.status, body: { error } };
  }
  return {
    status: 500,
    body: {
      error: {
        code: "internal",
        message: "Something went wrong on our side. Nothing was changed; please try again.",
      },
    },
  };
}
