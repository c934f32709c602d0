/**
 * Runs the fake payment provider on its own:
 *   node apps/api/dist/dev-services/payment-provider-fake/main.js --port 12111 \
 *     --webhook-url http://localhost:3000/api/billing/webhook --webhook-secret whsec_… [--state-file .data/payment-fake/dev.json]
 * Stops on SIGINT/SIGTERM. See docs/billing.md.
 */
import path from "node:path";
import { parseArgs } from "node:util";
import { startFakeProvider } from "./server.js";

const { values } = parseArgs({
  options: {
    port: { type: "string", default: "12111" },
    host: { type: "string", default: "127.0.0.1" },
    "webhook-url": { type: "string" },
    "webhook-secret": { type: "string", default: "whsec_ringdown_local_fake_webhook_secret" },
    "secret-key": { type: "string" },
    "state-file": { type: "string" },
  },
});

const port = Number(values.port);
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`[payment-fake] --port must be a port number, not "${values.port}"`);
  process.exit(1);
}

startFakeProvider({
  port,
  host: values.host,
  webhookSecret: values["webhook-secret"],
  ...(values["webhook-url"] ? { webhookUrl: values["webhook-url"] } : {}),
  ...(values["secret-key"] ? { secretKey: values["secret-key"] } : {}),
  ...(values["state-file"] ? { stateFile: path.resolve(values["state-file"]) } : {}),
})
  .then((fake) => {
    console.log(
      `[payment-fake] listening on ${fake.url}; webhooks to ${values["webhook-url"] ?? "(none)"}${values["state-file"] ? `; state in ${values["state-file"]}` : ""}`,
    );
    const stop = () => void fake.close().then(() => process.exit(0));
    process.on("SIGINT", stop);
    process.on("SIGTERM", stop);
  })
  .catch((error: unknown) => {
    const code = (error as { code?: string }).code;
    console.error(
      code === "EADDRINUSE" ? `[payment-fake] port ${port} is already in use; choose another with --port` : `[payment-fake] cannot start: ${String(error)}`,
    );
    process.exit(1);
  });
