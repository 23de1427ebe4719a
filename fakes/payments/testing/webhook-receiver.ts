// A small webhook endpoint for tests: records each request as received (raw body and
// signature header) and can be told to fail the next few with a chosen status.
import http from "node:http";
import type { Socket } from "node:net";

export interface ReceivedWebhook {
  body: string;
  signature: string | undefined;
  receivedAt: number;
  answeredWith: number;
}

export interface WebhookReceiver {
  url: string;
  received: ReceivedWebhook[];
  /** Answer the next `count` requests with `status` instead of 200. */
  failNext(count: number, status?: number): void;
  /** Polls until `predicate` holds for the received list, or throws after `timeoutMs`. */
  waitFor(predicate: (received: ReceivedWebhook[]) => boolean, timeoutMs?: number): Promise<void>;
  close(): Promise<void>;
}

export async function startWebhookReceiver(host = "127.0.0.1"): Promise<WebhookReceiver> {
  const received: ReceivedWebhook[] = [];
  let failures = 0;
  let failStatus = 500;
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (chunk: Buffer) => chunks.push(chunk));
    req.on("end", () => {
      const status = failures > 0 ? failStatus : 200;
      if (failures > 0) failures -= 1;
      received.push({
        body: Buffer.concat(chunks).toString("utf8"),
        signature: req.headers["stripe-signature"] as string | undefined,
        receivedAt: Date.now(),
        answeredWith: status,
      });
      res.writeHead(status, { "Content-Type": "application/json" });
      res.end(JSON.stringify({ received: status === 200 }));
    });
  });
  const sockets = new Set<Socket>();
  server.on("connection", (socket) => {
    sockets.add(socket);
    socket.on("close", () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => server.listen(0, host, resolve));
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : 0;
  return {
    url: `http://${host}:${port}/webhooks`,
    received,
    failNext(count, status = 500) {
      failures = count;
      failStatus = status;
    },
    async waitFor(predicate, timeoutMs = 10_000) {
      const deadline = Date.now() + timeoutMs;
      while (!predicate(received)) {
        if (Date.now() > deadline) throw new Error(`webhook receiver: condition not met within ${timeoutMs} ms (${received.length} received)`);
        await new Promise((resolve) => setTimeout(resolve, 15));
      }
    },
    close() {
      return new Promise<void>((resolve) => {
        server.close(() => resolve());
        for (const socket of sockets) socket.destroy();
      });
    },
  };
}
