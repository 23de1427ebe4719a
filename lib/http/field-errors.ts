import type { z } from "zod";

// Field errors as forms and JSON bodies carry them. Client-safe (no environment, no server-only):
// the catalog's client code parses its URL with the same schema and helper as the server.

/** Field path ("declaration.mainsVrms") → messages; "" holds errors about the body as a whole. */
export type FieldErrors = Record<string, string[]>;

/**
 * Adds a message under a key as an own property, so a field named "constructor" or "__proto__"
 * cannot reach Object.prototype. The record stays a plain object: server actions hand it to client
 * components, and React serialises only plain objects.
 */
export function addFieldError(out: FieldErrors, key: string, message: string): void {
  if (!Object.hasOwn(out, key)) Object.defineProperty(out, key, { value: [], enumerable: true, writable: true, configurable: true });
  out[key]!.push(message);
}

/**
 * One entry per issue under its dotted path; an unknown key (a strict object) is reported on that
 * key. `messageOf` rewords an issue where the schema's own message does not fit the caller.
 */
export function fieldErrorsFromZod(
  error: { issues: readonly z.core.$ZodIssue[] },
  messageOf: (issue: z.core.$ZodIssue) => string = (issue) => issue.message,
): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const path = issue.path.map(String);
    const message = messageOf(issue);
    if (issue.code === "unrecognized_keys") {
      for (const key of issue.keys) addFieldError(out, [...path, key].join("."), message);
    } else {
      addFieldError(out, path.join("."), message);
    }
  }
  return out;
}
