// Delivers events to each endpoint in the order they were created: one delivery at a
// time per endpoint, retried with doubling delays on a non-2xx answer or a network error.
import http from "node:http";
import https from "node:https";
import { newId } from "./ids";
import type { ApiEvent } from "./types";
import { signWebhookPayload } from "./webhook-signature";

export interface DispatcherOptions {
  /** Delay before the first retry; each further retry waits twice as long. */
  retryBaseMs: number;
  maxAttempts: number;
  timeoutMs: number;
  log: (line: string) => void;
}

export interface DeliveryAttempt {
  at: string;
  status_code: number | null;
  error: string | null;
  duration_ms: number;
}

export interface Delivery {
  id: string;
  event_id: string;
  event_type: string;
  endpoint: string;
  status: "pending" | "succeeded" | "failed";
  attempts: number;
  last_status_code: number | null;
  last_error: string | null;
  next_attempt_at: string | null;
  created_at: string;
  finished_at: string | null;
  history: DeliveryAttempt[];
}

interface EndpointQueue {
  url: string;
  secret: string;
  queue: Delivery[];
  busy: boolean;
}

export class WebhookDispatcher {
  private readonly endpoints: EndpointQueue[] = [];
  private readonly deliveries: Delivery[] = [];
  private readonly timers = new Set<NodeJS.Timeout>();
  private readonly inFlight = new Set<http.ClientRequest>();
  private closed = false;
  /** a test switch: while held, deliveries wait in their queues, as when the provider's event delivery lags */
  private held = false;

  constructor(
    private readonly options: DispatcherOptions,
    private readonly lookupEvent: (id: string) => ApiEvent | undefined,
    private readonly onDelivered: (event: ApiEvent) => void,
  ) {}

  addEndpoint(url: string, secret: string): void {
    const existing = this.endpoints.find((e) => e.url === url);
    if (existing) existing.secret = secret;
    else this.endpoints.push({ url, secret, queue: [], busy: false });
  }

  endpointCount(): number {
    return this.endpoints.length;
  }

  listEndpoints(): { url: string }[] {
    return this.endpoints.map((e) => ({ url: e.url }));
  }

  /** Queues the event for every endpoint, or only for `onlyUrl`; returns the new deliveries. */
  enqueue(event: ApiEvent, onlyUrl?: string): Delivery[] {
    const created: Delivery[] = [];
    for (const endpoint of this.endpoints) {
      if (onlyUrl && endpoint.url !== onlyUrl) continue;
      const delivery: Delivery = {
        id: newId("whdel"),
        event_id: event.id,
        event_type: event.type,
        endpoint: endpoint.url,
        status: "pending",
        attempts: 0,
        last_status_code: null,
        last_error: null,
        next_attempt_at: new Date().toISOString(),
        created_at: new Date().toISOString(),
        finished_at: null,
        history: [],
      };
      endpoint.queue.push(delivery);
      this.deliveries.push(delivery);
      created.push(delivery);
      this.pump(endpoint);
    }
    return created;
  }

  list(): Delivery[] {
    return this.deliveries;
  }

  /** Resolves once every queue is empty, or after `timeoutMs`; for tests and shutdown. */
  async idle(timeoutMs: number): Promise<boolean> {
    const deadline = Date.now() + timeoutMs;
    while (this.endpoints.some((e) => e.queue.length > 0)) {
      if (Date.now() > deadline) return false;
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
    return true;
  }

  isHeld(): boolean {
    return this.held;
  }

  /** Holds deliveries (none starts; one already on the wire finishes), or lets them go in order. */
  setHeld(held: boolean): void {
    this.held = held;
    if (!held) for (const endpoint of this.endpoints) this.pump(endpoint);
  }

  close(): void {
    this.closed = true;
    for (const timer of this.timers) clearTimeout(timer);
    this.timers.clear();
    for (const request of this.inFlight) request.destroy();
    this.inFlight.clear();
  }

  private pump(endpoint: EndpointQueue): void {
    if (this.closed || this.held || endpoint.busy) return;
    const head = endpoint.queue[0];
    if (!head) return;
    endpoint.busy = true;
    void this.attempt(endpoint, head);
  }

  private async attempt(endpoint: EndpointQueue, delivery: Delivery): Promise<void> {
    const event = this.lookupEvent(delivery.event_id);
    if (!event) {
      this.finish(endpoint, delivery, "failed");
      return;
    }
    // Indented like the provider's payloads; the signature covers these exact bytes.
    const payload = JSON.stringify(event, null, 2);
    const started = Date.now();
    delivery.attempts += 1;
    delivery.next_attempt_at = null;
    const result = await this.post(endpoint.url, payload, endpoint.secret);
    if (this.closed) return;
    delivery.last_status_code = result.statusCode;
    delivery.last_error = result.error;
    delivery.history.push({
      at: new Date(started).toISOString(),
      status_code: result.statusCode,
      error: result.error,
      duration_ms: Date.now() - started,
    });
    const ok = result.statusCode !== null && result.statusCode >= 200 && result.statusCode < 300;
    if (ok) {
      this.finish(endpoint, delivery, "succeeded");
      this.onDelivered(event);
      return;
    }
    if (delivery.attempts >= this.options.maxAttempts) {
      this.options.log(`webhook ${event.type} to ${endpoint.url} gave up after ${delivery.attempts} attempts`);
      this.finish(endpoint, delivery, "failed");
      return;
    }
    const delay = this.options.retryBaseMs * 2 ** (delivery.attempts - 1);
    delivery.next_attempt_at = new Date(Date.now() + delay).toISOString();
    const timer = setTimeout(() => {
      this.timers.delete(timer);
      if (this.held) {
        // Stays at the head of its queue; setHeld(false) tries it again.
        endpoint.busy = false;
        return;
      }
      void this.attempt(endpoint, delivery);
    }, delay);
    this.timers.add(timer);
  }

  private finish(endpoint: EndpointQueue, delivery: Delivery, status: "succeeded" | "failed"): void {
    delivery.status = status;
    delivery.finished_at = new Date().toISOString();
    endpoint.queue.shift();
    endpoint.busy = false;
    this.pump(endpoint);
  }

  private post(url: string, payload: string, secret: string): Promise<{ statusCode: number | null; error: string | null }> {
    return new Promise((resolve) => {
      let target: URL;
      try {
        target = new URL(url);
      } catch {
        resolve({ statusCode: null, error: "invalid endpoint URL" });
        return;
      }
      const client = target.protocol === "https:" ? https : http;
      const body = Buffer.from(payload, "utf8");
      const request = client.request(
        target,
        {
          method: "POST",
          // No keep-alive: a held socket would outlive close().
          agent: false,
          timeout: this.options.timeoutMs,
          headers: {
            "Content-Type": "application/json; charset=utf-8",
            "Content-Length": body.length,
            "User-Agent": "FluxyardPaymentsFake/1.0 (webhooks)",
            "Stripe-Signature": signWebhookPayload(payload, secret, Math.floor(Date.now() / 1000)),
          },
        },
        (response) => {
          response.resume();
          response.on("end", () => {
            this.inFlight.delete(request);
            resolve({ statusCode: response.statusCode ?? null, error: null });
          });
          response.on("error", (error) => {
            this.inFlight.delete(request);
            resolve({ statusCode: response.statusCode ?? null, error: error.message });
          });
        },
      );
      this.inFlight.add(request);
      request.on("timeout", () => request.destroy(new Error(`timed out after ${this.options.timeoutMs} ms`)));
      request.on("error", (error) => {
        this.inFlight.delete(request);
        resolve({ statusCode: null, error: error.message });
      });
      request.end(body);
    });
  }
}
