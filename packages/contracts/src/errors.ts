import { z } from "zod";

/** The one error envelope every API error uses. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    /** Field path (dot-joined) → human-readable message. */
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

/** Error codes shared by server and client. */
export const errorCodes = [
  "validation_failed",
  "unauthenticated",
  "forbidden",
  "not_found",
  "conflict",
  "rate_limited",
  "payload_too_large",
  "unsupported_media_type",
  "service_unavailable",
  "internal_error",
] as const;
export type ErrorCode = (typeof errorCodes)[number];
