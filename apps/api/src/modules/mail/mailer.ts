import nodemailer, { type Transporter } from "nodemailer";
import type { MailConfig } from "../../config/env.js";
import { AppError } from "../../http/app-error.js";

export interface OutgoingMail {
  to: string;
  subject: string;
  /** Plain-text part: every message has one. */
  text: string;
  /** HTML part: every message has one too. */
  html: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

const transports = new Map<string, Transporter>();

function transportFor(config: MailConfig): Transporter {
  const key = JSON.stringify(config.smtp);
  let transport = transports.get(key);
  if (!transport) {
    const { host, port, secure, ignoreTls, user, password } = config.smtp;
    transport = nodemailer.createTransport({
      host,
      port,
      secure,
      ignoreTLS: ignoreTls,
      ...(user ? { auth: { user, pass: password ?? "" } } : {}),
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 20_000,
    });
    transports.set(key, transport);
  }
  return transport;
}

/** Sends through SMTP as configured; a failure becomes a 503 the person can act on. */
export function createMailer(config: MailConfig): Mailer {
  return {
    async send(mail) {
      try {
        await transportFor(config).sendMail({ from: config.from, ...mail });
      } catch (error) {
        console.error(`[mail] sending "${mail.subject}" failed: ${error instanceof Error ? error.message : String(error)}`);
        throw new AppError("service_unavailable", "The e-mail could not be sent: the mail server did not accept it. Try again in a moment.", {
          cause: error,
        });
      }
    },
  };
}

/** Closes pooled SMTP connections (tests and shutdown). */
export function closeMailers(): void {
  for (const transport of transports.values()) transport.close();
  transports.clear();
}
