import type { Mailer, OutgoingMail } from "./mailer.js";

const inFlight = new Set<Promise<void>>();

/**
 * Sends without making the request wait: used where the response must not reveal whether a
 * message was sent (password resets), so answers take the same time either way. Failures are
 * logged by the mailer.
 */
export function sendInBackground(mailer: Mailer, mail: OutgoingMail): void {
  const work = mailer.send(mail).catch(() => undefined);
  inFlight.add(work);
  void work.finally(() => inFlight.delete(work));
}

/** Waits for messages still being sent (shutdown, tests). */
export async function settleBackgroundMail(): Promise<void> {
  await Promise.allSettled([...inFlight]);
}
