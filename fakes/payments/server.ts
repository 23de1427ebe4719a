// A local stand-in for the payments provider that the real `stripe` SDK talks to over
// plain HTTP on loopback: the API under /v1, hosted checkout and onboarding pages,
// signed webhooks, and /api/test hooks for tests.
import http from "node:http";
import type { Socket } from "node:net";
import { handleApi } from "./api-gateway";
import { FakeClock } from "./clock";
import { internalOrigin, type FakeContext } from "./context";
import { expireDueSessions } from "./core/checkout";
import { showCheckout, submitCheckout } from "./hosted/checkout-routes";
import { showOnboarding, submitOnboarding } from "./hosted/onboarding-routes";
import { BodyTooLargeError, readBody, sendHtml, sendJson } from "./http-util";
import { renderMessagePage } from "./pages/layout";
import { FakeStore } from "./store";
import { handleTestHook, type TestControls } from "./test-hooks";
import { WebhookDispatcher } from "./webhook-dispatcher";

export interface PaymentsFakeOptions {
  port?: number;
  host?: string;
  /** Base URL a browser uses for the hosted pages; default http://HOST:PORT. */
  publicUrl?: string;
  webhooks?: { url: string; secret: string }[];
  /** JSON file that keeps the state across restarts. */
  storeFile?: string;
  /** Delay before the first webhook retry; doubles each time. Default 1000 ms. */
  webhookRetryBaseMs?: number;
  /** Attempts per delivery before giving up. Default 8. */
  webhookMaxAttempts?: number;
  webhookTimeoutMs?: number;
  /** How often open checkout sessions are checked for expiry. Default 1000 ms. */
  expiryCheckMs?: number;
  /** Reported on events when a request names none; default that of stripe@23.1.0. */
  apiVersion?: string;
  log?: (line: string) => void;
}

export interface PaymentsFake {
  url: string;
  close(): Promise<void>;
}

// The API version stripe@23.1.0 pins (its apiVersion.js).
const DEFAULT_API_VERSION = "2026-10-28.endive";

function isLoopback(host: string): boolean {
  return host === "localhost" || host === "::1" || /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(host);
}

export async function startPaymentsFake(options: PaymentsFakeOptions = {}): Promise<PaymentsFake> {
  const host = options.host ?? "127.0.0.1";
  if (!isLoopback(host)) throw new Error(`payments fake: refusing to listen on ${host}; use a loopback address`);
  const log = options.log ?? ((line: string) => console.warn(line));
  const store = new FakeStore(options.storeFile);
  const clock = new FakeClock(store.state.clockOffsetSeconds);
  let down = false;

  // The context is completed once the port is known (port 0 picks a free one).
  const ctx = { store, clock, log, defaultApiVersion: options.apiVersion ?? DEFAULT_API_VERSION } as FakeContext;
  const dispatcher = new WebhookDispatcher(
    {
      retryBaseMs: options.webhookRetryBaseMs ?? 1000,
      maxAttempts: options.webhookMaxAttempts ?? 8,
      timeoutMs: options.webhookTimeoutMs ?? 10_000,
      log,
    },
    (id) => store.state.events[id],
    (event) => {
      event.pending_webhooks = Math.max(0, event.pending_webhooks - 1);
      store.changed();
    },
  );
  ctx.dispatcher = dispatcher;
  for (const endpoint of options.webhooks ?? []) dispatcher.addEndpoint(endpoint.url, endpoint.secret);
  for (const endpoint of store.state.webhookEndpoints) dispatcher.addEndpoint(endpoint.url, endpoint.secret);

  const controls: TestControls = {
    isDown: () => down,
    setDown: (value) => {
      down = value;
    },
    addEndpoint: (url, secret) => {
      dispatcher.addEndpoint(url, secret);
      const kept = store.state.webhookEndpoints.filter((e) => e.url !== url);
      store.state.webhookEndpoints = [...kept, { url, secret }];
      store.changed();
    },
    reset: () => {
      const endpoints = store.state.webhookEndpoints;
      store.reset();
      store.state.webhookEndpoints = endpoints;
    },
  };

  const handle = async (req: http.IncomingMessage, res: http.ServerResponse): Promise<void> => {
    const url = new URL(req.url ?? "/", "http://payments.local");
    const method = req.method ?? "GET";
    const rawBody = await readBody(req);
    const path = url.pathname;
    if (path === "/api/health" && method === "GET") {
      sendJson(res, down ? 503 : 200, down ? { ok: false, service: "payments", down: true } : { ok: true, service: "payments" });
      return;
    }
    if (path.startsWith("/api/test/")) {
      handleTestHook(ctx, controls, res, method, url, rawBody);
      return;
    }
    if (path.startsWith("/v1/")) {
      handleApi(ctx, req, res, url, rawBody, down);
      return;
    }
    const hosted = /^\/(pay|onboarding)\/([^/]+)$/.exec(path);
    if (hosted && (method === "GET" || method === "POST")) {
      if (down) {
        sendHtml(res, 503, renderMessagePage("Payments are unavailable", "The local payments fake is simulating an outage. Try again shortly."));
        return;
      }
      let id: string;
      try {
        id = decodeURIComponent(hosted[2] ?? "");
      } catch {
        sendHtml(res, 404, renderMessagePage("Page not found", "This address is not known to the local payments fake."));
        return;
      }
      if (hosted[1] === "pay") {
        if (method === "GET") showCheckout(ctx, res, id);
        else submitCheckout(ctx, res, id, rawBody);
      } else if (method === "GET") showOnboarding(ctx, res, id);
      else submitOnboarding(ctx, res, id, rawBody);
      return;
    }
    sendJson(res, 404, { error: { type: "invalid_request_error", message: `Nothing at ${method} ${path} on the local payments fake.` } });
  };

  const server = http.createServer((req, res) => {
    handle(req, res).catch((error: unknown) => {
      if (error instanceof BodyTooLargeError) {
        if (!res.headersSent) sendJson(res, 413, { error: { type: "invalid_request_error", message: error.message } });
        return;
      }
      log(`payments fake: ${req.method} ${req.url} failed: ${(error as Error).stack ?? String(error)}`);
      if (!res.headersSent) sendJson(res, 500, { error: { type: "api_error", message: "Internal error in the local payments fake." } });
      else res.destroy();
    });
  });
  const sockets = new Set<Socket>();
  server.on("connection", (socket) => {
    sockets.add(socket);
    socket.on("close", () => sockets.delete(socket));
  });

  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port ?? 4020, host, () => {
      server.off("error", reject);
      resolve();
    });
  });
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : (options.port ?? 4020);
  const hostInUrl = host.includes(":") ? `[${host}]` : host;
  const url = `http://${hostInUrl}:${port}`;
  ctx.publicUrl = (options.publicUrl ?? url).replace(/\/+$/, "");

  const expiryTimer = setInterval(() => {
    try {
      expireDueSessions(ctx, internalOrigin(ctx));
    } catch (error) {
      log(`payments fake: expiry sweep failed: ${(error as Error).message}`);
    }
  }, options.expiryCheckMs ?? 1000);
  expiryTimer.unref();

  let closing: Promise<void> | undefined;
  const close = (): Promise<void> => {
    closing ??= new Promise<void>((resolve) => {
      clearInterval(expiryTimer);
      dispatcher.close();
      server.close(() => resolve());
      server.closeAllConnections();
      for (const socket of sockets) socket.destroy();
      store.close();
    });
    return closing;
  };

  return { url, close };
}
