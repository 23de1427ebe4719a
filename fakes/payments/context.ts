import type { FakeClock } from "./clock";
import { newId } from "./ids";
import type { FakeStore } from "./store";
import type { ApiEvent } from "./types";
import type { WebhookDispatcher } from "./webhook-dispatcher";

/** The API request a change came from, recorded on the events it causes. */
export interface Origin {
  requestId: string | null;
  idempotencyKey: string | null;
  apiVersion: string;
}

export interface FakeContext {
  store: FakeStore;
  clock: FakeClock;
  dispatcher: WebhookDispatcher;
  publicUrl: string;
  defaultApiVersion: string;
  log: (line: string) => void;
}

/** Changes made by the fake itself (timers, hosted pages) rather than by an API call. */
export function internalOrigin(ctx: FakeContext): Origin {
  return { requestId: null, idempotencyKey: null, apiVersion: ctx.defaultApiVersion };
}

// Event payloads are snapshots: later changes to the object must not alter them.
function snapshot<T>(value: T): T {
  return structuredClone(value);
}

export function emitEvent(
  ctx: FakeContext,
  origin: Origin,
  type: string,
  object: unknown,
  previousAttributes?: Record<string, unknown>,
): ApiEvent {
  const event: ApiEvent = {
    id: newId("evt"),
    object: "event",
    api_version: origin.apiVersion,
    created: ctx.clock.now(),
    data: previousAttributes
      ? { object: snapshot(object), previous_attributes: snapshot(previousAttributes) }
      : { object: snapshot(object) },
    livemode: false,
    pending_webhooks: ctx.dispatcher.endpointCount(),
    request: { id: origin.requestId, idempotency_key: origin.idempotencyKey },
    type,
  };
  ctx.store.state.events[event.id] = event;
  ctx.store.changed();
  ctx.dispatcher.enqueue(event);
  return event;
}

/** The fields of `before` that differ from `after`, as `previous_attributes` lists them. */
export function changedFields<T extends object>(before: T, after: T): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of Object.keys(after) as (keyof T)[]) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) out[key as string] = before[key];
  }
  return out;
}
