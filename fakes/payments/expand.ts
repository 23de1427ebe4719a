// `expand[]=payment_intent.latest_charge`: replaces id strings by the objects they name.
import { invalidParam } from "./api-error";
import type { FakeState } from "./state";
import { findById } from "./state";

const MAX_EXPAND_DEPTH = 4;

type Bag = Record<string, unknown>;

export function expandObject<T>(state: FakeState, value: T, paths: string[]): T {
  if (paths.length === 0) return value;
  const copy = structuredClone(value) as unknown;
  for (const path of paths) {
    const segments = path.split(".");
    if (segments.length > MAX_EXPAND_DEPTH) {
      throw invalidParam("expand", `You cannot expand more than ${MAX_EXPAND_DEPTH} levels of a property. Property: ${path}`);
    }
    expandInto(state, copy, segments, path);
  }
  return copy as T;
}

function expandInto(state: FakeState, target: unknown, segments: string[], path: string): void {
  const [field, ...rest] = segments;
  if (field === undefined || typeof target !== "object" || target === null) return;
  const bag = target as Bag;
  if (bag.object === "list" && field === "data" && Array.isArray(bag.data)) {
    for (const item of bag.data) expandInto(state, item, rest, path);
    return;
  }
  if (field === "line_items" && bag.object === "checkout.session" && typeof bag.id === "string") {
    const items = state.lineItems[bag.id] ?? [];
    bag.line_items = { object: "list", data: structuredClone(items), has_more: false, url: `/v1/checkout/sessions/${bag.id}/line_items` };
  } else if (typeof bag[field] === "string") {
    const found = findById(state, bag[field] as string);
    if (found === undefined) throw invalidParam("expand", `This property cannot be expanded (${field}).`);
    bag[field] = structuredClone(found);
  } else if (!(field in bag)) {
    throw invalidParam("expand", `This property cannot be expanded (${path}).`);
  }
  expandInto(state, bag[field], rest, path);
}
