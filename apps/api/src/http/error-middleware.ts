import type { ErrorRequestHandler, RequestHandler } from "express";
import { BaseError, UniqueConstraintError } from "sequelize";
import { ZodError } from "zod";
import type { ApiError, ErrorCode } from "@ringdown/contracts";
import { isDatabaseUnavailable } from "../db/connection-errors.js";
import { AppError, statusByCode } from "./app-error.js";
import { fieldErrors } from "./validate.js";

/** Errors raised by express.json() (body-parser) carry a `type`; http-errors carry `status` + `expose`. */
type BodyParserError = Error & { type?: string; status?: number; expose?: boolean };

const codeByClientStatus: Record<number, ErrorCode> = {
  400: "validation_failed",
  401: "unauthenticated",
  403: "forbidden",
  404: "not_found",
  413: "payload_too_large",
  415: "unsupported_media_type",
};

function toAppError(err: unknown): AppError | undefined {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) return AppError.validation("Some fields need attention.", fieldErrors(err));
  if (err instanceof UniqueConstraintError) {
    const fields = Object.fromEntries(Object.keys(err.fields ?? {}).map((f) => [f, "This value is already in use."]));
    return AppError.conflict("That already exists.", Object.keys(fields).length > 0 ? fields : undefined);
  }
  // The database stopped, restarting, or its connection cut: a clear 503, never a 500 (the pool
  // replaces broken connections by itself, so the next request after its return succeeds).
  if (isDatabaseUnavailable(err)) {
    return new AppError("service_unavailable", "The database is unavailable. Try again in a moment.", {
      cause: err,
      retryAfterSeconds: 5,
    });
  }
  if (err instanceof BaseError) return undefined;
  const type = (err as BodyParserError | undefined)?.type;
  switch (type) {
    case "entity.parse.failed":
      return AppError.validation("The request body is not valid JSON.");
    case "entity.too.large":
      return new AppError("payload_too_large", "The request body is too large.");
    case "encoding.unsupported":
    case "charset.unsupported":
      return new AppError("unsupported_media_type", "Send the request body as UTF-8 JSON.");
    default:
      break;
  }
  // Client errors raised by Express itself (the router marks a path parameter it cannot decode
  // with status 400; any other URIError is a fault of ours).
  if (err instanceof URIError && (err as BodyParserError).status === 400) return AppError.validation("The address contains an invalid %-escape.");
  const { status, expose, message } = (err ?? {}) as BodyParserError;
  if (typeof status === "number" && status >= 400 && status < 500 && expose) {
    return new AppError(codeByClientStatus[status] ?? "validation_failed", message || "The request is not valid.");
  }
  return undefined;
}

/** The one error middleware: maps every error onto `{ error: { code, message, fields? } }`. */
export const errorMiddleware: ErrorRequestHandler = (err, req, res, next) => {
  if (res.headersSent) {
    next(err);
    return;
  }
  const appError = toAppError(err);
  let body: ApiError;
  let status: number;
  if (appError) {
    status = statusByCode[appError.code];
    body = { error: { code: appError.code, message: appError.message } };
    if (appError.fields) body.error.fields = appError.fields;
    if (appError.retryAfterSeconds !== undefined) res.setHeader("Retry-After", String(appError.retryAfterSeconds));
    if (appError.code === "service_unavailable") logError(res.locals.requestId, req.method, req.originalUrl, err);
  } else {
    status = 500;
    const requestId = String(res.locals.requestId ?? "unknown");
    logError(requestId, req.method, req.originalUrl, err);
    body = {
      error: { code: "internal_error", message: `Something went wrong on our side. Reference: ${requestId}.` },
    };
  }
  res.status(status).json(body);
};

function logError(requestId: unknown, method: string, url: string, err: unknown): void {
  const detail = err instanceof Error ? (err.stack ?? err.message) : String(err);
  console.error(`[request ${String(requestId)}] ${method} ${url} failed: ${detail}`);
}

/** Unknown /api/* routes answer with the error envelope, not the web app. */
export const apiNotFound: RequestHandler = (req) => {
  throw AppError.notFound(`No API route ${req.method} ${req.originalUrl.split("?")[0]}.`);
};
