// Decodes the SDK's form bodies (`line_items[0][price_data][unit_amount]=500`,
// `metadata[order]=o_1`, `expand[0]=x` or `expand[]=x`) into nested objects and arrays,
// the way the payments API reads them.

export type FormValue = string | FormValue[] | FormObject;
export interface FormObject {
  [key: string]: FormValue;
}

export class FormDecodeError extends Error {}

const MAX_DEPTH = 12;
// An index beyond this is almost certainly an attack or a bug, not a real list.
const MAX_INDEX = 1000;
const FORBIDDEN_KEYS = new Set(["__proto__", "prototype", "constructor"]);

export function decodeFormBody(text: string): FormObject {
  const root: FormObject = {};
  for (const pair of text.split("&")) {
    if (pair === "") continue;
    const eq = pair.indexOf("=");
    const key = decodeComponent(eq === -1 ? pair : pair.slice(0, eq));
    const value = decodeComponent(eq === -1 ? "" : pair.slice(eq + 1));
    assignPath(root, parseKeyPath(key), value);
  }
  return compactArrays(root) as FormObject;
}

function decodeComponent(raw: string): string {
  try {
    return decodeURIComponent(raw.replace(/\+/g, " "));
  } catch {
    throw new FormDecodeError(`Malformed percent-encoding in form body near "${raw.slice(0, 40)}".`);
  }
}

/** `a[b][0][]` → ["a", "b", "0", ""]; a key with unbalanced brackets stays literal. */
export function parseKeyPath(key: string): string[] {
  const open = key.indexOf("[");
  if (open <= 0) return [key];
  const head = key.slice(0, open);
  const rest = key.slice(open);
  const segments: string[] = [];
  const pattern = /\[([^[\]]*)\]/g;
  let consumed = 0;
  for (let match = pattern.exec(rest); match; match = pattern.exec(rest)) {
    if (match.index !== consumed) return [key];
    segments.push(match[1] ?? "");
    consumed = pattern.lastIndex;
  }
  if (consumed !== rest.length) return [key];
  return [head, ...segments];
}

function isIndex(segment: string): boolean {
  return segment === "" || /^\d+$/.test(segment);
}

type Container = FormObject | FormValue[];

function assignPath(root: FormObject, path: string[], value: string): void {
  if (path.length > MAX_DEPTH) throw new FormDecodeError(`Parameter nesting too deep: ${path.join(".")}.`);
  for (const segment of path) {
    if (FORBIDDEN_KEYS.has(segment)) throw new FormDecodeError(`Invalid parameter name: ${segment}.`);
  }
  let container: Container = root;
  for (let i = 0; i < path.length; i += 1) {
    const segment = path[i] ?? "";
    const last = i === path.length - 1;
    // Metadata keys are free text, so `metadata[0]` is a key, not a list position.
    const nextIsIndex = !last && segment !== "metadata" && isIndex(path[i + 1] ?? "");
    const child: FormValue = last ? value : nextIsIndex ? [] : {};
    container = step(container, segment, child, last);
  }
}

/** Puts `child` at `segment` unless a container is already there; returns what is there now. */
function step(container: Container, segment: string, child: FormValue, last: boolean): Container {
  if (Array.isArray(container)) {
    if (!isIndex(segment)) throw new FormDecodeError(`Cannot mix list positions and names at "${segment}".`);
    const index = segment === "" ? container.length : Number(segment);
    if (index > MAX_INDEX) throw new FormDecodeError(`List position ${index} is too large.`);
    const existing = container[index];
    if (last || existing === undefined || typeof existing === "string") container[index] = child;
    return container[index] as Container;
  }
  const existing = container[segment];
  if (last || existing === undefined || typeof existing === "string") container[segment] = child;
  return container[segment] as Container;
}

// `a[5]=x` alone yields a list with holes; the API treats lists as dense.
function compactArrays(value: FormValue): FormValue {
  if (typeof value === "string") return value;
  if (Array.isArray(value)) {
    return value.filter((item) => item !== undefined).map(compactArrays);
  }
  const out: FormObject = {};
  for (const [key, item] of Object.entries(value)) out[key] = compactArrays(item);
  return out;
}

export function isFormObject(value: FormValue | undefined): value is FormObject {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}
