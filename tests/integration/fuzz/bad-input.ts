// Generators of the input a JSON API must refuse without falling over: text that is not JSON,
// JSON of the wrong shape, valid examples with one field replaced by something hostile, huge and
// NaN-like numbers, unicode that trips naive code (lone surrogates, NUL, bidi overrides, combining
// storms), deep nesting and prototype keys. Bodies are built as JSON *text*, because some of the
// nastiest cases (1e999, a lone surrogate escape, 400-digit integers) cannot come out of
// JSON.stringify. The catalogue of tricks is common practice in API fuzzing (OWASP Web Security
// Testing Guide 4.2, WSTG-INPV; RFC 8259 §6 on numbers beyond IEEE 754 double and §8.2 on
// unpaired surrogates).
import fc from "fast-check";

/** A token written into the JSON text as it is: numbers JSON.stringify cannot write, raw escapes, deep nesting. */
export class RawJson {
  constructor(readonly text: string) {}
}

export function toJsonText(value: unknown): string {
  if (value instanceof RawJson) return value.text;
  if (Array.isArray(value)) return `[${value.map((v) => (v === undefined ? "null" : toJsonText(v))).join(",")}]`;
  if (value !== null && typeof value === "object") {
    const entries = Object.keys(value).flatMap((key) => {
      const v = (value as Record<string, unknown>)[key];
      return v === undefined ? [] : [`${JSON.stringify(key)}:${toJsonText(v)}`];
    });
    return `{${entries.join(",")}}`;
  }
  if (typeof value === "number" && !Number.isFinite(value)) return "null";
  if (typeof value === "bigint") return value.toString();
  return JSON.stringify(value) ?? "null";
}

/**
 * The text a route reads from the request: encoded as UTF-8 on the way in (a lone surrogate becomes
 * U+FFFD) and decoded by `request.text()`, which drops a leading byte-order mark (WHATWG Encoding,
 * "UTF-8 decode"; Node's fetch drops two, so every leading one counts as gone).
 */
export function asReceived(text: string): string {
  return new TextDecoder().decode(new TextEncoder().encode(text)).replace(/^\uFEFF+/, "");
}

/** Whether the route would read the text as JSON. */
export function parsesAsJson(text: string): boolean {
  try {
    JSON.parse(asReceived(text));
    return true;
  } catch {
    return false;
  }
}

const BROKEN_JSON = [
  "{",
  "}",
  "[",
  "{'title': 'single quotes'}",
  '{"title": "trailing comma",}',
  "{title: 1}",
  '{"a": 01}',
  '{"a": .5}',
  '{"a": +1}',
  '{"a": NaN}',
  '{"a": Infinity}',
  '{"a": undefined}',
  '{"a": 0x10}',
  "NaN",
  "undefined",
  '"unterminated',
  '{"a": "\\x41"}',
  '{"a": "\\u12"}',
  "// comment\n{}",
  '{"a": 1} {"b": 2}',
  '{"a": 1} trailing',
  '{"a":"line\nbreak"}',
  '{"a": "tab\there"}',
  "\u0000",
  "[1, 2,, 3]",
  '{"a" 1}',
  '{"a": tru}',
  "<xml/>",
  "a=1&b=2",
];

/** Text that JSON.parse refuses (and that is not blank, which some routes read as `{}`). */
export const malformedJson: fc.Arbitrary<string> = fc
  .oneof(
    fc.constantFrom(...BROKEN_JSON),
    // A valid document cut short.
    fc
      .json({ maxDepth: 3 })
      .filter((t) => t.length > 1)
      .chain((t) => fc.integer({ min: 1, max: t.length - 1 }).map((n) => t.slice(0, n))),
    fc.string({ unit: "binary", minLength: 1, maxLength: 40 }),
  )
  .filter((t) => asReceived(t).trim() !== "" && !parsesAsJson(t));

export const NAN_LIKE = [
  "NaN",
  "nan",
  "Infinity",
  "-Infinity",
  "1e999",
  "-1e999",
  "0x1F",
  "0b101",
  "0o17",
  "1_000",
  "1,5",
  "12abc",
  "١٢٣",
  "１２",
  "",
  " ",
  "\t",
  "null",
  "undefined",
  "true",
  "[object Object]",
  "+",
  "-",
  ".",
  "e5",
  "9".repeat(400),
  "-0",
  "5e-400",
];

const HUGE_NUMBERS = [
  new RawJson("1e999"),
  new RawJson("-1e999"),
  new RawJson("1" + "0".repeat(400)),
  new RawJson("9007199254740993"),
  new RawJson("-9223372036854775809"),
  new RawJson("5e-324"),
  new RawJson("1e-400"),
  new RawJson("-0"),
  1.7976931348623157e308,
  -1.7976931348623157e308,
  2 ** 31,
  -(2 ** 31) - 1,
  2 ** 53,
  0.1 + 0.2,
];

export const TRICKY_UNICODE = [
  new RawJson('"\\ud800"'),
  new RawJson('"tail \\udfff"'),
  new RawJson('"\\u0000"'),
  "\u0000",
  "nul\u0000inside",
  "\u202Egnirts desrever",
  "zero\u200Bwidth\u200Djoiner",
  "e" + "\u0301".repeat(500),
  "👩🏽‍🔧".repeat(20),
  "𝔘𝔫𝔦𝔠𝔬𝔡𝔢",
  "İıſﬃ",
  "\uFFFE\uFFFF",
  "\r\n\r\n",
  "'; drop table users; --",
  "%00%0d%0a",
  "../../../../etc/passwd",
  "${7*7}{{7*7}}",
  "<script>alert(1)</script>",
];

/** Deeply nested arrays and objects, written directly as text. */
const deepNesting = fc.integer({ min: 50, max: 4000 }).chain((depth) =>
  fc.constantFrom(new RawJson("[".repeat(depth) + "]".repeat(depth)), new RawJson('{"a":'.repeat(depth) + "1" + "}".repeat(depth))),
);

const prototypeKeys = fc.constantFrom(
  new RawJson('{"__proto__": {"isAdmin": true, "roles": ["admin"]}}'),
  new RawJson('{"constructor": {"prototype": {"polluted": 1}}}'),
  new RawJson('{"toString": 1, "valueOf": "x", "hasOwnProperty": null}'),
);

/** One value that no well-typed field should take as it is. */
export const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constant(null),
  fc.boolean(),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.constantFrom(...HUGE_NUMBERS),
  fc.constantFrom(...NAN_LIKE),
  fc.constantFrom(...TRICKY_UNICODE),
  fc.string({ unit: "grapheme", maxLength: 30 }),
  fc.string({ unit: "binary", maxLength: 30 }),
  // Longer than any text field allows, still under the routes' body limits.
  fc.integer({ min: 2_001, max: 21_000 }).map((n) => "ж".repeat(n)),
  fc.array(fc.jsonValue({ maxDepth: 2 }), { maxLength: 5 }),
  fc.object({ maxDepth: 2, maxKeys: 4 }),
  deepNesting,
  prototypeKeys,
);

/** A whole body that is JSON, but not an object of the expected shape. */
export const wrongShape: fc.Arbitrary<unknown> = fc.oneof(
  hostileValue,
  fc.array(fc.object({ maxDepth: 1, maxKeys: 3 }), { minLength: 1, maxLength: 3 }),
  fc.dictionary(fc.string({ unit: "grapheme", maxLength: 12 }), hostileValue, { maxKeys: 5 }),
);

export type BadBody = {
  text: string;
  /** What the case is, for the failure message. */
  label: "malformed" | "wrong-shape" | "mutated";
  /** The one field of a valid example that was replaced or dropped. */
  field?: string;
};

/**
 * Bodies for a route whose valid body looks like `example`: malformed text, wrong shapes, and the
 * example with one field replaced by a hostile value or dropped (plus a few junk keys). Only
 * bodies that `accepts` refuses are kept, so a fuzzed request can never legitimately act.
 */
export function badBodies(example: Record<string, unknown> | undefined, accepts: ((body: unknown) => boolean) | undefined): fc.Arbitrary<BadBody> {
  const malformed = malformedJson.map((text): BadBody => ({ text, label: "malformed" }));
  if (!example || !accepts) return malformed;
  const keys = Object.keys(example);
  const shaped = wrongShape.map((value): BadBody => ({ text: toJsonText(value), label: "wrong-shape" }));
  const refused = (b: BadBody) => !parsesAsJson(b.text) || !accepts(JSON.parse(asReceived(b.text)));
  if (keys.length === 0) return fc.oneof(malformed, shaped).filter(refused);
  const mutated = fc
    .record({
      field: fc.constantFrom(...keys),
      value: hostileValue,
      drop: fc.boolean(),
      junk: fc.dictionary(fc.string({ unit: "grapheme-ascii", minLength: 1, maxLength: 10 }), hostileValue, { maxKeys: 2 }),
    })
    .map(({ field, value, drop, junk }): BadBody => {
      const body: Record<string, unknown> = { ...junk, ...example };
      if (drop) delete body[field];
      else body[field] = value;
      return { text: toJsonText(body), label: "mutated", field };
    });
  return fc.oneof(malformed, shaped, mutated, mutated).filter(refused);
}

/** Path segments that name nothing: not ids, ids of nothing, and the usual traversal and injection tricks. */
export const hostileId: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(
    "00000000-0000-0000-0000-000000000000",
    "ffffffff-ffff-ffff-ffff-ffffffffffff",
    "0b7d1c3e-5a21-4c6e-9f10-00000000000",
    "0b7d1c3e5a214c6e9f10000000000001",
    "{0b7d1c3e-5a21-4c6e-9f10-000000000001}",
    "..",
    "../../admin",
    "%2e%2e%2f",
    "' or '1'='1",
    "1; select pg_sleep(1)",
    "null",
    "undefined",
    "NaN",
    "-1",
    "0",
    "9".repeat(40),
    "\u0000",
    "ü",
    "x".repeat(5000),
  ),
  fc.uuid(),
  fc.string({ unit: "grapheme", minLength: 1, maxLength: 60 }),
);

/** Query strings: known keys with hostile values, unknown keys, repeated keys. */
export function hostileQuery(keys: readonly string[]): fc.Arbitrary<[string, string][]> {
  const value = fc.oneof(
    fc.constantFrom(...NAN_LIKE),
    fc.constantFrom(...TRICKY_UNICODE.filter((v): v is string => typeof v === "string")),
    fc.string({ unit: "grapheme", maxLength: 40 }),
    fc.string({ unit: "binary", maxLength: 40 }),
    fc.integer({ min: 190, max: 6000 }).map((n) => "q".repeat(n)),
    fc.integer().map(String),
    fc.double().map(String),
  );
  const key = fc.oneof({ weight: 4, arbitrary: keys.length ? fc.constantFrom(...keys) : fc.constant("q") }, { weight: 1, arbitrary: fc.string({ maxLength: 12 }) });
  return fc.array(fc.tuple(key, value), { minLength: 1, maxLength: 6 });
}
