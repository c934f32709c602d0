/**
 * A local SMTP server that accepts every message and stores it in a folder (see ./store.ts)
 * instead of delivering it. Stands in for a real mail service in development and tests, on
 * loopback only. Importable (tests start one on a free port) and runnable on its own (./main.ts).
 */
import type { AddressInfo } from "node:net";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";
import { writeMail, type StoredMail } from "./store.js";

export interface MailCaptureOptions {
  /** 0 picks a free port. */
  port: number;
  /** Loopback by default: the capture server must never be reachable from the network. */
  host?: string;
  /** Folder the messages are written to. */
  dir: string;
  /** Called after each stored message. */
  onMessage?: (mail: StoredMail) => void;
}

export interface MailCapture {
  port: number;
  dir: string;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(value) ? value : value ? [value] : [];
  return list.flatMap((a) => a.value.map((v) => (v.name ? `${v.name} <${v.address ?? ""}>` : (v.address ?? ""))));
}

export function startMailCapture(options: MailCaptureOptions): Promise<MailCapture> {
  const server = new SMTPServer({
    // Plain SMTP on loopback: the library's built-in certificate is not valid, so no STARTTLS.
    disabledCommands: ["STARTTLS"],
    authOptional: true,
    allowInsecureAuth: true,
    // Accepts any credentials, so production-like settings with SMTP_USER work locally too.
    onAuth: (_auth, _session, callback) => callback(null, { user: "capture" }),
    size: MAX_MESSAGE_BYTES,
    banner: "Ringdown local mail capture (messages are stored, never delivered)",
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (chunk: Buffer) => chunks.push(chunk));
      stream.on("error", callback);
      stream.on("end", () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          callback(Object.assign(new Error("Message exceeds the 10 MB limit"), { responseCode: 552 }));
          return;
        }
        const raw = Buffer.concat(chunks);
        simpleParser(raw)
          .then((parsed) =>
            writeMail(
              options.dir,
              {
                receivedAt: new Date().toISOString(),
                envelope: {
                  from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
                  to: session.envelope.rcptTo.map((r) => r.address),
                },
                from: addresses(parsed.from).join(", "),
                to: addresses(parsed.to),
                subject: parsed.subject ?? "",
                text: parsed.text ?? "",
                html: typeof parsed.html === "string" ? parsed.html : null,
              },
              raw,
            ),
          )
          .then((stored) => {
            options.onMessage?.(stored);
            callback();
          })
          .catch((error: unknown) => callback(error instanceof Error ? error : new Error(String(error))));
      });
    },
  });

  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port, options.host ?? "127.0.0.1", () => {
      server.off("error", reject);
      server.on("error", (error) => console.error("[mail-capture]", error));
      const port = (server.server.address() as AddressInfo).port;
      resolve({
        port,
        dir: options.dir,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
