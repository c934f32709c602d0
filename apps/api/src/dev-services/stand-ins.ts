/**
 * Starts both local stand-ins (mail capture and the fake payment provider) on free loopback ports
 * for one test file, and gives the configuration that points the API at them.
 */
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import type { AppConfig } from "../config/env.js";
import { startMailCapture, type MailCapture } from "./mail-capture/server.js";
import { readMails, type StoredMail } from "./mail-capture/store.js";
import { startFakeProvider, type RunningFakeProvider } from "./payment-provider-fake/server.js";

export const STAND_IN_WEBHOOK_SECRET = "whsec_stand_in_tests_only_0123456789";

export interface StandIns {
  mail: MailCapture;
  payments: RunningFakeProvider;
  /** Overrides for `testConfig`: SMTP and the provider on the stand-ins. */
  config(base: AppConfig): Partial<AppConfig>;
  /** The newest captured message to `to` (waits up to ~10 s for it to arrive). */
  waitForMail(to: string, match?: (m: StoredMail) => boolean): Promise<StoredMail>;
  close(): Promise<void>;
}

export async function startStandIns(): Promise<StandIns> {
  const dir = await mkdtemp(path.join(tmpdir(), "ringdown-mail-"));
  const mail = await startMailCapture({ port: 0, dir });
  const payments = await startFakeProvider({ port: 0, webhookSecret: STAND_IN_WEBHOOK_SECRET });
  return {
    mail,
    payments,
    config: (base) => ({
      mail: { ...base.mail, smtp: { ...base.mail.smtp, host: "127.0.0.1", port: mail.port, ignoreTls: true }, captureDir: dir },
      billing: {
        ...base.billing,
        enabled: true,
        secretKey: "sk_test_stand_in_tests",
        webhookSecret: STAND_IN_WEBHOOK_SECRET,
        apiUrl: new URL(payments.url),
      },
    }),
    async waitForMail(to, match = () => true) {
      for (let attempt = 0; attempt < 200; attempt++) {
        const found = (await readMails(dir)).find((m) => m.envelope.to.includes(to) && match(m));
        if (found) return found;
        await new Promise((r) => setTimeout(r, 50));
      }
      throw new Error(`no message to ${to} arrived at the capture server`);
    },
    async close() {
      await Promise.all([mail.close(), payments.close()]);
      await rm(dir, { recursive: true, force: true });
    },
  };
}
