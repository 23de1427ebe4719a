// Typed readers over a decoded form body. Each failure names the parameter in the
// API's bracket notation so the SDK error points at the field the caller got wrong.
import { invalidParam, missingParam } from "./api-error";
import { isFormObject, type FormObject, type FormValue } from "./form-body";

export type Metadata = Record<string, string>;

export function paramName(prefix: string, key: string): string {
  return prefix ? `${prefix}[${key}]` : key;
}

export function rejectUnknown(obj: FormObject, allowed: readonly string[], prefix = ""): void {
  for (const key of Object.keys(obj)) {
    if (!allowed.includes(key)) {
      const name = paramName(prefix, key);
      throw invalidParam(name, `Received unknown parameter: ${name}`, "parameter_unknown");
    }
  }
}

// An empty string is how the SDK sends `null`: it unsets the field.
function present(obj: FormObject, key: string): FormValue | undefined {
  const value = obj[key];
  return value === "" ? undefined : value;
}

export function optString(obj: FormObject, key: string, prefix = ""): string | undefined {
  const value = present(obj, key);
  if (value === undefined) return undefined;
  if (typeof value !== "string") throw invalidParam(paramName(prefix, key), `Invalid string: ${paramName(prefix, key)}`);
  return value;
}

export function reqString(obj: FormObject, key: string, prefix = ""): string {
  const value = optString(obj, key, prefix);
  if (value === undefined) throw missingParam(paramName(prefix, key));
  return value;
}

export function optInt(obj: FormObject, key: string, prefix = "", min = 0): number | undefined {
  const value = present(obj, key);
  if (value === undefined) return undefined;
  const name = paramName(prefix, key);
  if (typeof value !== "string" || !/^-?\d+$/.test(value)) {
    throw invalidParam(name, `Invalid integer: ${typeof value === "string" ? value : "(object)"}`, "parameter_invalid_integer");
  }
  const n = Number(value);
  if (!Number.isSafeInteger(n)) throw invalidParam(name, `Invalid integer: ${value}`, "parameter_invalid_integer");
  if (n < min) throw invalidParam(name, `This value must be greater than or equal to ${min}.`, "parameter_invalid_integer");
  return n;
}

export function reqInt(obj: FormObject, key: string, prefix = "", min = 0): number {
  const value = optInt(obj, key, prefix, min);
  if (value === undefined) throw missingParam(paramName(prefix, key));
  return value;
}

export function optBool(obj: FormObject, key: string, prefix = ""): boolean | undefined {
  const value = present(obj, key);
  if (value === undefined) return undefined;
  if (value === "true") return true;
  if (value === "false") return false;
  throw invalidParam(paramName(prefix, key), `Invalid boolean: ${typeof value === "string" ? value : "(object)"}`);
}

export function optEnum<T extends string>(obj: FormObject, key: string, values: readonly T[], prefix = ""): T | undefined {
  const value = optString(obj, key, prefix);
  if (value === undefined) return undefined;
  if (!(values as readonly string[]).includes(value)) {
    const name = paramName(prefix, key);
    throw invalidParam(name, `Invalid ${name}: must be one of ${values.join(", ")}`);
  }
  return value as T;
}

export function optObject(obj: FormObject, key: string, prefix = ""): FormObject | undefined {
  const value = present(obj, key);
  if (value === undefined) return undefined;
  if (!isFormObject(value)) throw invalidParam(paramName(prefix, key), `Invalid object: ${paramName(prefix, key)}`);
  return value;
}

export function optArray(obj: FormObject, key: string, prefix = ""): FormValue[] | undefined {
  const value = present(obj, key);
  if (value === undefined) return undefined;
  if (!Array.isArray(value)) throw invalidParam(paramName(prefix, key), `Invalid array: ${paramName(prefix, key)}`);
  return value;
}

export function optStringArray(obj: FormObject, key: string, prefix = ""): string[] | undefined {
  const list = optArray(obj, key, prefix);
  if (list === undefined) return undefined;
  return list.map((item, index) => {
    if (typeof item !== "string") throw invalidParam(`${paramName(prefix, key)}[${index}]`, "Invalid string");
    return item;
  });
}

export function optCurrency(obj: FormObject, key: string, prefix = ""): string | undefined {
  const value = optString(obj, key, prefix);
  if (value === undefined) return undefined;
  if (!/^[a-zA-Z]{3}$/.test(value)) {
    throw invalidParam(paramName(prefix, key), `Invalid currency: ${value}. Use a three-letter ISO code in lowercase.`);
  }
  return value.toLowerCase();
}

export function reqCurrency(obj: FormObject, key: string, prefix = ""): string {
  const value = optCurrency(obj, key, prefix);
  if (value === undefined) throw missingParam(paramName(prefix, key));
  return value;
}

export function optUrl(obj: FormObject, key: string, prefix = ""): string | undefined {
  const value = optString(obj, key, prefix);
  if (value === undefined) return undefined;
  // `{CHECKOUT_SESSION_ID}` is a template the provider fills in later; braces are not valid URL syntax.
  const probe = value.replace(/\{CHECKOUT_SESSION_ID\}/g, "x");
  let url: URL | undefined;
  try {
    url = new URL(probe);
  } catch {
    url = undefined;
  }
  if (!url || (url.protocol !== "http:" && url.protocol !== "https:")) {
    throw invalidParam(paramName(prefix, key), "Not a valid URL", "url_invalid");
  }
  return value;
}

// Limits as the provider documents them for metadata (from memory): 50 keys,
// key names up to 40 characters, values up to 500 characters.
const METADATA_MAX_KEYS = 50;
const METADATA_MAX_KEY_LENGTH = 40;
const METADATA_MAX_VALUE_LENGTH = 500;

/** `undefined` = leave as is, `null` = clear all, otherwise changes where "" deletes a key. */
export function optMetadata(obj: FormObject, key = "metadata", prefix = ""): Record<string, string> | null | undefined {
  const raw = obj[key];
  if (raw === undefined) return undefined;
  if (raw === "") return null;
  const name = paramName(prefix, key);
  if (!isFormObject(raw)) throw invalidParam(name, "Invalid hash");
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(raw)) {
    if (typeof v !== "string") throw invalidParam(`${name}[${k}]`, "Metadata values must be strings.");
    if (k.length > METADATA_MAX_KEY_LENGTH) {
      throw invalidParam(`${name}[${k}]`, `Metadata keys can be at most ${METADATA_MAX_KEY_LENGTH} characters long.`);
    }
    if (v.length > METADATA_MAX_VALUE_LENGTH) {
      throw invalidParam(`${name}[${k}]`, `Metadata values can be at most ${METADATA_MAX_VALUE_LENGTH} characters long.`);
    }
    out[k] = v;
  }
  return out;
}

export function applyMetadata(current: Metadata, change: Record<string, string> | null | undefined, param = "metadata"): Metadata {
  if (change === undefined) return current;
  if (change === null) return {};
  const next: Metadata = { ...current };
  for (const [k, v] of Object.entries(change)) {
    if (v === "") delete next[k];
    else next[k] = v;
  }
  if (Object.keys(next).length > METADATA_MAX_KEYS) {
    throw invalidParam(param, `You can have up to ${METADATA_MAX_KEYS} metadata keys.`);
  }
  return next;
}

export function expandPaths(obj: FormObject): string[] {
  return optStringArray(obj, "expand") ?? [];
}
