/**
 * Thrown for any input a formula cannot honestly answer: non-numbers, NaN, ±Infinity,
 * negative magnitudes, or zero where the physics has no answer (a zero core area, a zero
 * frequency). `field` names the offending argument so an API can put the message beside
 * the right form input.
 */
export class EngineeringInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = "EngineeringInputError";
    this.field = field;
  }
}

function requireNumber(field: string, value: unknown): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new EngineeringInputError(field, `${field} must be a finite number.`);
  }
  return value;
}

export function requireFinite(field: string, value: unknown): number {
  return requireNumber(field, value);
}

export function requirePositive(field: string, value: unknown): number {
  const n = requireNumber(field, value);
  if (n <= 0) throw new EngineeringInputError(field, `${field} must be greater than zero.`);
  return n;
}

export function requireNonNegative(field: string, value: unknown): number {
  const n = requireNumber(field, value);
  if (n < 0) throw new EngineeringInputError(field, `${field} must not be negative.`);
  return n;
}

export function requireRange(field: string, value: unknown, min: number, max: number): number {
  const n = requireNumber(field, value);
  if (n < min || n > max) {
    throw new EngineeringInputError(field, `${field} must be between ${min} and ${max}.`);
  }
  return n;
}

export function requireOneOf<T extends string>(
  field: string,
  value: unknown,
  allowed: readonly T[],
): T {
  if (typeof value !== "string" || !(allowed as readonly string[]).includes(value)) {
    throw new EngineeringInputError(field, `${field} must be one of: ${allowed.join(", ")}.`);
  }
  return value as T;
}

/** Guards the promise that no function returns NaN or Infinity, even when inputs overflow. */
export function finiteResult(field: string, value: number): number {
  if (!Number.isFinite(value)) {
    throw new EngineeringInputError(field, `${field} is too large or too small to give a finite result.`);
  }
  return value;
}

/** Objects arrive from JSON and from JavaScript callers; a missing object is an input error too. */
export function requireObject(field: string, value: unknown): Record<string, unknown> {
  if (typeof value !== "object" || value === null) {
    throw new EngineeringInputError(field, `${field} must be an object of named inputs.`);
  }
  return value as Record<string, unknown>;
}

/** Samples arrive as plain arrays or typed arrays (a parsed capture holds Float64Arrays). */
export function isNumberList(value: unknown): value is ArrayLike<number> {
  return Array.isArray(value) || (ArrayBuffer.isView(value) && !(value instanceof DataView));
}
