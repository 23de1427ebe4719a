import { expect } from "vitest";
import { EngineeringInputError } from "@/lib/engineering";

/** |actual − expected| ≤ rel·|expected|: published figures are rounded, so compare relatively. */
export function expectRelClose(actual: number, expected: number, rel: number): void {
  expect(Number.isFinite(actual)).toBe(true);
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));
}

/** Every number anywhere inside a result is finite. */
export function allNumbersFinite(value: unknown): boolean {
  if (typeof value === "number") return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allNumbersFinite);
  if (value && typeof value === "object") return Object.values(value).every(allNumbersFinite);
  return true;
}

/** The call throws an EngineeringInputError whose field is `field`. */
export function expectFieldError(run: () => unknown, field: string): void {
  let thrown: unknown;
  try {
    run();
  } catch (error) {
    thrown = error;
  }
  expect(thrown, `expected EngineeringInputError on ${field}`).toBeInstanceOf(EngineeringInputError);
  expect((thrown as EngineeringInputError).field).toBe(field);
}
