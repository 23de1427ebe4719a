import { invalidParam } from "../api-error";
import type { FormObject } from "../form-body";
import { optStringArray } from "../params";

/** `allowed_payment_method_types` (which replaced `payment_method_types` in this API version); cards only here. */
export function readAllowedMethods(input: FormObject): string[] | undefined {
  if (input.payment_method_types !== undefined) {
    throw invalidParam(
      "payment_method_types",
      "Received unknown parameter: payment_method_types. This API version uses allowed_payment_method_types.",
      "parameter_unknown",
    );
  }
  const methods = optStringArray(input, "allowed_payment_method_types");
  if (methods && methods.some((m) => m !== "card")) {
    throw invalidParam("allowed_payment_method_types", "The local payments fake accepts only card payments.");
  }
  return methods;
}

