import { recordIdSchema } from "@ringdown/contracts";
import { AppError } from "../../http/app-error.js";

/** A route's id parameter; anything but a UUID is a record that does not exist (404, never 400). */
export function idParam(raw: unknown, what: string): string {
  const parsed = recordIdSchema.safeParse(raw);
  if (!parsed.success) throw AppError.notFound(`${what} not found.`);
  return parsed.data;
}
