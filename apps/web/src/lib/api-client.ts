import { apiErrorSchema } from "@ringdown/contracts";
import type { z } from "zod";

/** Codes the client adds on top of the server's own error codes. */
export type ClientErrorCode = "network_error" | "bad_response";

/**
 * An error answered by the API (or met on the way to it), in the shape of the
 * one error envelope: `{ error: { code, message, fields? } }`.
 */
export class ApiError extends Error {
  override readonly name = "ApiError";
  constructor(
    /** HTTP status; 0 when the server could not be reached. */
    readonly status: number,
    readonly code: string,
    message: string,
    /** Field path (dot-joined, as sent) → message. */
    readonly fields: Readonly<Record<string, string>> = {},
  ) {
    super(message);
  }

  get isUnauthenticated(): boolean {
    return this.status === 401;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type Method = "GET" | "POST" | "PATCH" | "PUT" | "DELETE";

export interface RequestOptions<S extends z.ZodType | undefined> {
  method?: Method;
  body?: unknown;
  /** Contract schema of the success body; the response is parsed with it. */
  schema?: S;
  signal?: AbortSignal;
}

type Result<S> = S extends z.ZodType ? z.output<S> : undefined;

const statusMessages: Record<number, string> = {
  502: "The Ringdown server is not answering (502 Bad Gateway). Try again in a moment.",
  503: "The Ringdown server is unavailable right now (503). Try again in a moment.",
  504: "The Ringdown server took too long to answer (504). Try again in a moment.",
};

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === "") return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

/**
 * Calls the Ringdown API on the same origin with the session cookie.
 * Resolves with the parsed body (checked against `schema` when given);
 * rejects with an {@link ApiError} for every failure, never a bare `Error`.
 */
export async function apiRequest<S extends z.ZodType | undefined = undefined>(
  path: string,
  options: RequestOptions<S> = {},
): Promise<Result<S>> {
  const { method = "GET", body, schema, signal } = options;
  const headers: Record<string, string> = { Accept: "application/json" };
  // FormData (file uploads) goes as multipart: the browser sets the boundary header itself.
  const isForm = typeof FormData !== "undefined" && body instanceof FormData;
  if (body !== undefined && !isForm) headers["Content-Type"] = "application/json";

  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method,
      headers,
      credentials: "same-origin",
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
      signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === "AbortError") throw cause;
    throw new ApiError(0, "network_error", "Cannot reach the Ringdown server. Check the connection and try again.");
  }

  const payload = await readJson(response);

  if (!response.ok) {
    const envelope = apiErrorSchema.safeParse(payload);
    if (envelope.success) {
      const { code, message, fields } = envelope.data.error;
      throw new ApiError(response.status, code, message, fields ?? {});
    }
    throw new ApiError(
      response.status,
      response.status === 401 ? "unauthenticated" : "bad_response",
      statusMessages[response.status] ??
        `The server answered ${response.status} ${response.statusText}`.trim() + " without an explanation.",
    );
  }

  if (!schema) return undefined as Result<S>;
  const parsed = schema.safeParse(payload);
  if (!parsed.success) {
    throw new ApiError(
      response.status,
      "bad_response",
      "The server's answer did not have the expected shape. Reload the page; if it persists, report it.",
    );
  }
  return parsed.data as Result<S>;
}
