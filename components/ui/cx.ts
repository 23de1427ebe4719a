/** Joins class names, skipping falsy ones; enough for our variants without a dependency. */
export function cx(...parts: Array<string | false | null | undefined>): string {
  return parts.filter(Boolean).join(" ");
}
