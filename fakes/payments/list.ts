// Cursor pagination as the API does it: newest first, `limit` 1–100 (default 10),
// `starting_after` / `ending_before` by id, and `created` filters.
import { invalidParam } from "./api-error";
import type { FormObject } from "./form-body";
import { optInt, optObject, optString } from "./params";
import type { ListObject } from "./types";

interface Listable {
  id: string;
  created: number;
}

export const LIST_PARAMS = ["limit", "starting_after", "ending_before", "created", "expand"] as const;

export function paginate<T extends Listable>(itemsOldestFirst: T[], query: FormObject, url: string): ListObject<T> {
  const limit = optInt(query, "limit", "", 1) ?? 10;
  if (limit > 100) throw invalidParam("limit", "This value must be less than or equal to 100.");
  const newestFirst = itemsOldestFirst.filter(createdFilter(query)).reverse();
  const startingAfter = optString(query, "starting_after");
  const endingBefore = optString(query, "ending_before");
  if (startingAfter) {
    const index = newestFirst.findIndex((item) => item.id === startingAfter);
    if (index === -1) throw invalidParam("starting_after", `No such object: '${startingAfter}'`, "resource_missing");
    const rest = newestFirst.slice(index + 1);
    return { object: "list", data: rest.slice(0, limit), has_more: rest.length > limit, url };
  }
  if (endingBefore) {
    const index = newestFirst.findIndex((item) => item.id === endingBefore);
    if (index === -1) throw invalidParam("ending_before", `No such object: '${endingBefore}'`, "resource_missing");
    const before = newestFirst.slice(0, index);
    return { object: "list", data: before.slice(Math.max(0, before.length - limit)), has_more: before.length > limit, url };
  }
  return { object: "list", data: newestFirst.slice(0, limit), has_more: newestFirst.length > limit, url };
}

function createdFilter(query: FormObject): (item: Listable) => boolean {
  if (query.created === undefined || query.created === "") return () => true;
  if (typeof query.created === "string") {
    const exact = optInt(query, "created");
    return (item) => item.created === exact;
  }
  const range = optObject(query, "created") ?? {};
  const gt = optInt(range, "gt", "created");
  const gte = optInt(range, "gte", "created");
  const lt = optInt(range, "lt", "created");
  const lte = optInt(range, "lte", "created");
  return (item) =>
    (gt === undefined || item.created > gt) &&
    (gte === undefined || item.created >= gte) &&
    (lt === undefined || item.created < lt) &&
    (lte === undefined || item.created <= lte);
}
