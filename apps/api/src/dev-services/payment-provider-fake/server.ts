import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import { createFakeProvider, type FakeProvider, type FakeProviderOptions } from "./fake-app.js";

export interface RunningFakeProvider extends FakeProvider {
  port: number;
  url: string;
  close(): Promise<void>;
}

/** Starts the fake payment provider on loopback (port 0 = a free port). */
export function startFakeProvider(options: FakeProviderOptions & { port: number; host?: string }): Promise<RunningFakeProvider> {
  const fake = createFakeProvider(options);
  const host = options.host ?? "127.0.0.1";
  return new Promise((resolve, reject) => {
    const server: Server = fake.app.listen(options.port, host);
    server.once("error", reject);
    server.once("listening", () => {
      server.off("error", reject);
      const port = (server.address() as AddressInfo).port;
      const url = `http://${host}:${port}`;
      fake.setPublicUrl(url);
      resolve({
        ...fake,
        port,
        url,
        close: () =>
          new Promise<void>((done) => {
            server.close(() => done());
            server.closeAllConnections();
          }),
      });
    });
  });
}
