/**
 * Turns what people type (V, µF, kΩ, mm², kHz …) into the SI body the shared zod schemas of
 * lib/validations/calc.ts expect, and the schemas' complaints back into messages in the units
 * of the field. Pure, so the forms can run it on every keystroke.
 */
import type { z } from "zod";
import { EngineeringInputError } from "@/lib/engineering";

export interface NumberSpec {
  /** the field's name in messages, e.g. "Bus capacitance" */
  label: string;
  /** the unit the person types in, e.g. "µF"; "" for plain counts */
  unit: string;
  /** typed value × toSi = the SI value */
  toSi: number;
  /** for fields that are not a plain scale of the SI value (a diameter given for an area) */
  fromSi?: (si: number) => number;
  /** what to say when the text is not a usable value at all */
  invalidMessage?: string;
}

export type FieldErrors<K extends string = string> = Partial<Record<K, string[]>>;

export type Outcome<R, K extends string = string> =
  { ok: true; result: R } | { ok: false; fieldErrors: FieldErrors<K>; message: string };

/** "" (left empty) → undefined; anything else → its number, NaN when it is none. */
export function readNumber(text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  // type="number" already gives "."; a pasted "0,68" from a spreadsheet should still work.
  const trimmed = text.trim().replace(",", ".");
  if (trimmed === "") return undefined;
  return Number(trimmed);
}

/** The typed text in SI units, or undefined when the field is empty. */
export function readSi(text: string | undefined, spec: NumberSpec): number | undefined {
  const value = readNumber(text);
  return value === undefined ? undefined : value * spec.toSi;
}

const plain = new Intl.NumberFormat("en", { maximumSignificantDigits: 6, useGrouping: false });

function inFieldUnits(si: number, spec: NumberSpec): string {
  const value = spec.fromSi ? spec.fromSi(si) : si / spec.toSi;
  return `${plain.format(value)}${spec.unit ? ` ${spec.unit}` : ""}`;
}

type Issue = z.ZodError["issues"][number];

// "Core area Ae" → "core area Ae", but an initial symbol such as "AL" stays as written.
function lowerFirst(label: string): string {
  return /^[A-Z][a-z]/.test(label) ? label.charAt(0).toLowerCase() + label.slice(1) : label;
}

/** A schema issue in the words and units of the field it belongs to. */
export function issueMessage(issue: Issue, spec: NumberSpec | undefined): string {
  if (spec && issue.code === "too_small") {
    const bound = issue.inclusive === false ? "greater than" : "at least";
    return `${spec.label} must be ${bound} ${inFieldUnits(Number(issue.minimum), spec)}.`;
  }
  if (spec && issue.code === "too_big") {
    const bound = issue.inclusive === false ? "less than" : "at most";
    return `${spec.label} must be ${bound} ${inFieldUnits(Number(issue.maximum), spec)}.`;
  }
  const unusable =
    issue.code === "invalid_type" ||
    issue.code === "invalid_union" ||
    issue.code === "invalid_value" ||
    issue.code === "custom";
  if (spec?.invalidMessage && unusable) return spec.invalidMessage;
  // zod reports a fraction where a whole number is wanted as invalid_type "int"; its own
  // message ("Turns must be a whole number.") already says it best.
  if (issue.code === "invalid_type" && issue.expected === "int") return issue.message;
  if (spec && issue.code === "invalid_type") return `Enter ${lowerFirst(spec.label)} as a number.`;
  return issue.message;
}

export interface ErrorMapping<K extends string> {
  /** message wording per schema key */
  specs: Partial<Record<string, NumberSpec>>;
  /** schema key → the form field that shows its error, where the two differ */
  fieldOf?: Partial<Record<string, K>>;
}

/** Field errors keyed by form field; issues about the body as a whole go into `general`. */
export function errorsFromZod<K extends string>(error: z.ZodError, mapping: ErrorMapping<K>) {
  const fieldErrors: FieldErrors<K> = {};
  const general: string[] = [];
  for (const issue of error.issues) {
    const key = issue.path.map(String).join(".");
    const field = (mapping.fieldOf?.[key] ?? key) as K;
    const message = issueMessage(issue, mapping.specs[key]);
    if (key === "") general.push(message);
    else (fieldErrors[field] ??= []).push(message);
  }
  return { fieldErrors, general };
}

/** The summary line under a form whose inputs do not validate. */
export function invalidMessage(count: number): string {
  return count === 1
    ? "Check the highlighted input; results update as you type."
    : "Check the highlighted inputs; results update as you type.";
}

/**
 * Runs a calculation, turning an engineering input error (a combination the schema lets
 * through but the physics cannot answer) into a message instead of a crash.
 */
export function compute<R, K extends string>(run: () => R, fieldOf: Partial<Record<string, K>> = {}): Outcome<R, K> {
  try {
    return { ok: true, result: run() };
  } catch (error) {
    if (error instanceof EngineeringInputError) {
      const field = fieldOf[error.field];
      return {
        ok: false,
        fieldErrors: field ? ({ [field]: [error.message] } as FieldErrors<K>) : {},
        message: `These inputs cannot be computed: ${error.message}`,
      };
    }
    throw error;
  }
}

/** Merges several error maps (schema issues and the form's own checks). */
export function mergeErrors<K extends string>(...maps: FieldErrors<K>[]): FieldErrors<K> {
  const out: FieldErrors<K> = {};
  for (const map of maps) {
    for (const [key, messages] of Object.entries(map) as [K, string[] | undefined][]) {
      if (messages && messages.length > 0) (out[key] ??= []).push(...messages);
    }
  }
  return out;
}

export function countErrors(errors: FieldErrors): number {
  return Object.values(errors).filter((m) => m !== undefined && m.length > 0).length;
}
