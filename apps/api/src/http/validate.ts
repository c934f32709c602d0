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

const NUL = "\u0000";
const NUL_SCAN_DEPTH = 32;

/**
 * Fields whose text holds U+0000 (dot path → message): PostgreSQL text cannot store it, so such
 * input is refused (by `validate`, and by the routes that parse uploads themselves) rather than
 * failing, or being silently altered, on its way to the database.
 */
export function nulCharacterFields(value: unknown, path: string[]): Record<string, string> {
  const out: Record<string, string> = {};
  // A walk with its own stack, no deeper than any contract reaches (they strip what they do not
  // name): hostile bodies nest hundreds of thousands of levels deep.
  const pending: [unknown, string[]][] = [[value, path]];
  for (let next = pending.pop(); next; next = pending.pop()) {
    const [item, at] = next;
    if (typeof item === "string") {
      if (item.includes(NUL)) out[at.join(".")] = "Remove the NUL character (U+0000)";
    } else if (item !== null && typeof item === "object" && at.length < NUL_SCAN_DEPTH) {
      for (const [key, child] of Object.entries(item)) pending.push([child, [...at, key]]);
    }
  }
  return out;
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
      const raw: unknown = part === "body" ? (req.body ?? {}) : req[part];
      Object.assign(fields, nulCharacterFields(raw, part === "body" ? [] : [part]));
      const result = schema.safeParse(raw);
      if (result.success) {
        parsed[part] = result.data;
        continue;
      }
      for (const [key, message] of Object.entries(fieldErrors(result.error, part === "body" ? undefined : part))) fields[key] ??= message;
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
