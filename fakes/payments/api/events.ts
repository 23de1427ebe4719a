import { noSuch } from "../api-error";
import { LIST_PARAMS, paginate } from "../list";
import { optString, optStringArray, rejectUnknown } from "../params";
import type { ApiCall, Route } from "../router";

/** `type` may end in `.*` to match a family of events, as the provider allows. */
function typeMatcher(pattern: string): (type: string) => boolean {
  if (pattern.endsWith(".*")) {
    const prefix = pattern.slice(0, -1);
    return (type) => type.startsWith(prefix);
  }
  return (type) => type === pattern;
}

function list(call: ApiCall): unknown {
  rejectUnknown(call.input, [...LIST_PARAMS, "type", "types", "delivery_success"]);
  const single = optString(call.input, "type");
  const many = optStringArray(call.input, "types");
  const matchers = [...(single ? [single] : []), ...(many ?? [])].map(typeMatcher);
  const events = Object.values(call.ctx.store.state.events).filter(
    (event) => matchers.length === 0 || matchers.some((match) => match(event.type)),
  );
  return paginate(events, call.input, "/v1/events");
}

function retrieve(call: ApiCall): unknown {
  const id = call.params.id ?? "";
  const event = call.ctx.store.state.events[id];
  if (!event) throw noSuch("event", id, "id");
  return event;
}

export const eventRoutes: Route[] = [
  { method: "GET", pattern: "/v1/events", handler: list },
  { method: "GET", pattern: "/v1/events/:id", handler: retrieve },
];
