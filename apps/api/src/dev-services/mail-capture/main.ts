/**
 * Runs the local mail capture server on its own:
 *   node apps/api/dist/dev-services/mail-capture/main.js --port 2525 --dir .data/mail-capture/dev
 * Stops on SIGINT/SIGTERM.
 */
import path from "node:path";
import { parseArgs } from "node:util";
import { startMailCapture } from "./server.js";

const { values } = parseArgs({
  options: {
    port: { type: "string", default: "2525" },
    host: { type: "string", default: "127.0.0.1" },
    dir: { type: "string", default: ".data/mail-capture/dev" },
  },
});

const port = Number(values.port);
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  console.error(`[mail-capture] --port must be a port number, not "${values.port}"`);
  process.exit(1);
}

startMailCapture({
  port,
  host: values.host,
  dir: path.resolve(values.dir),
  onMessage: (mail) => console.log(`[mail-capture] ${mail.receivedAt} to ${mail.to.join(", ")}: ${mail.subject}`),
})
  .then((capture) => {
    console.log(`[mail-capture] listening on smtp://${values.host}:${capture.port}, storing in ${capture.dir}`);
    const stop = () => void capture.close().then(() => process.exit(0));
    process.on("SIGINT", stop);
    process.on("SIGTERM", stop);
  })
  .catch((error: unknown) => {
    const code = (error as { code?: string }).code;
    console.error(
      code === "EADDRINUSE"
        ? `[mail-capture] port ${port} is already in use; choose another with --port`
        : `[mail-capture] cannot start: ${String(error)}`,
    );
    process.exit(1);
  });
