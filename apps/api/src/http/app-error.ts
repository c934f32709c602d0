import type { ErrorCode } from "@ringdown/contracts";

/**
 * The one error type services throw. It carries a code from the shared contract, never an HTTP
 * status: the error middleware maps codes onto statuses.
 */
export class AppError extends Error {
  readonly code: ErrorCode;
  readonly fields: Record<string, string> | undefined;
  /** Seconds the client should wait before retrying (rate limits). */
  readonly retryAfterSeconds: number | undefined;

  constructor(
    code: ErrorCode,
    message: string,
    options: { fields?: Record<string, string>; retryAfterSeconds?: number; cause?: unknown } = {},
  ) {
    super(message, options.cause === undefined ? undefined : { cause: options.cause });
    this.name = "AppError";
    this.code = code;
    this.fields = options.fields;
    this.retryAfterSeconds = options.retryAfterSeconds;
  }

  static notFound(message = "Not found."): AppError {
    return new AppError("not_found", message);
  }

  static unauthenticated(message = "Sign in to continue."): AppError {
    return new AppError("unauthenticated", message);
  }

  static forbidden(message = "Your role in this shop does not allow this."): AppError {
    return new AppError("forbidden", message);
  }

  static conflict(message: string, fields?: Record<string, string>): AppError {
    return new AppError("conflict", message, fields ? { fields } : {});
  }

  static validation(message: string, fields?: Record<string, string>): AppError {
    return new AppError("validation_failed", message, fields ? { fields } : {});
  }
}

export const statusByCode: Record<ErrorCode, number> = {
  validation_failed: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  internal_error: 500,
  service_unavailable: 503,
};
