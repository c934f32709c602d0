import type { RequestHandler, Response } from "express";
import { z } from "zod";
import { AppError } from "./app-error.js";

/** The parts of a request a route validates, each with its contract schema. */
export type InputSchemas = {
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
};

export type ParsedInput<S extends InputSchemas> = { [K in keyof S]: S[K] extends z.ZodType ? z.output<S[K]> : never };

const INPUT_KEY = "input";

/** Turns zod issues into the envelope's `fields` (dot path → first message for that path). */
export function fieldErrors(error: z.ZodError, prefix?: string): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = [prefix, ...issue.path.map(String)].filter((p) => p !== undefined && p !== "").join(".");
    if (key && !(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

/**
 * Validates body, query and params with the route's contract schemas and keeps the parsed values
 * in `res.locals` (Express 5's `req.query` is read-only); read them back with `inputOf`.
 * Body field paths are bare ("email"); query and params paths are prefixed ("query.page").
 */
export function validate<S extends InputSchemas>(schemas: S): RequestHandler {
  return (req, res, next) => {
    const parsed: Record<string, unknown> = {};
    const fields: Record<string, string> = {};
    let rootMessage: string | undefined;
    for (const part of ["params", "query", "body"] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(part === "body" ? (req.body ?? {}) : req[part]);
      if (result.success) {
        parsed[part] = result.data;
        continue;
      }
      Object.assign(fields, fieldErrors(result.error, part === "body" ? undefined : part));
      rootMessage ??= result.error.issues.find((i) => i.path.length === 0)?.message;
    }
    if (Object.keys(fields).length > 0 || rootMessage) {
      const message = rootMessage ?? "Some fields need attention.";
      throw AppError.validation(message, Object.keys(fields).length > 0 ? fields : undefined);
    }
    res.locals[INPUT_KEY] = parsed;
    next();
  };
}

/** The values `validate(schemas)` parsed for this request, typed by the same schemas. */
export function inputOf<S extends InputSchemas>(res: Response, _schemas: S): ParsedInput<S> {
  const input = res.locals[INPUT_KEY] as ParsedInput<S> | undefined;
  if (!input) throw new Error("inputOf() used on a route without validate()");
  return input;
}
