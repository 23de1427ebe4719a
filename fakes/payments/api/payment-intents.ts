import { invalidParam, missingParam, noSuch } from "../api-error";
import { outcomeForPaymentMethod } from "../card-outcomes";
import { assertConfirmable, cancelPaymentIntent, capturePaymentIntent, cardError, confirmPaymentIntent, newPaymentIntent } from "../core/charging";
import { assertCanReceive } from "../core/transfers";
import { changedFields, emitEvent } from "../context";
import { expandObject } from "../expand";
import type { FormObject } from "../form-body";
import { LIST_PARAMS, paginate } from "../list";
import { formatMinor, minimumCharge } from "../money";
import {
  applyMetadata,
  expandPaths,
  optBool,
  optEnum,
  optInt,
  optMetadata,
  optObject,
  optString,
  optUrl,
  rejectUnknown,
  reqCurrency,
  reqInt,
  reqString,
} from "../params";
import type { ApiCall, Route } from "../router";
import { readAllowedMethods } from "./allowed-methods";
import type { PaymentIntent } from "../types";

const CREATE_KEYS = [
  "amount", "currency", "capture_method", "confirm", "payment_method", "allowed_payment_method_types", "metadata",
  "transfer_group", "application_fee_amount", "transfer_data", "description", "receipt_email",
  "automatic_payment_methods", "return_url", "off_session", "statement_descriptor_suffix", "expand",
];
const CAPTURE_METHODS = ["automatic", "automatic_async", "manual"] as const;

function findIntent(call: ApiCall): PaymentIntent {
  const id = call.params.id ?? "";
  const intent = call.ctx.store.state.paymentIntents[id];
  if (!intent) throw noSuch("payment_intent", id, "intent");
  return intent;
}

function checkPaymentMethod(id: string): void {
  if (!outcomeForPaymentMethod(id)) {
    throw invalidParam(
      "payment_method",
      `No such PaymentMethod: '${id}'. The local payments fake knows pm_card_visa, pm_card_chargeDeclined and pm_card_chargeDeclinedInsufficientFunds.`,
      "resource_missing",
    );
  }
}

// Since automatic payment methods became the default (API 2023-08-16), confirming on the
// server without a return_url is refused unless redirects are ruled out, by
// allow_redirects=never or by allowing only cards (from memory).
function checkRedirectRule(intent: PaymentIntent, returnUrl: string | null | undefined): void {
  const apm = intent.automatic_payment_methods;
  if (apm?.enabled && apm.allow_redirects !== "never" && !returnUrl) {
    throw invalidParam(
      "return_url",
      "This PaymentIntent is configured to accept payment methods enabled in your Dashboard. Because some of these payment methods might redirect your customer off of your page, you must provide a `return_url`. If you don't want to accept redirect-based payment methods, set `automatic_payment_methods[enabled]` to `true` and `automatic_payment_methods[allow_redirects]` to `never`, or pass `payment_method_types`.",
    );
  }
}

function readTransferData(call: ApiCall): PaymentIntent["transfer_data"] {
  const data = optObject(call.input, "transfer_data");
  if (!data) return null;
  rejectUnknown(data, ["destination", "amount"], "transfer_data");
  const destination = reqString(data, "destination", "transfer_data");
  assertCanReceive(call.ctx.store.state.accounts[destination], destination, "transfer_data[destination]");
  const amount = optInt(data, "amount", "transfer_data", 1);
  return amount === undefined ? { destination } : { destination, amount };
}

function readAutomaticPaymentMethods(input: FormObject, hasTypes: boolean): PaymentIntent["automatic_payment_methods"] {
  const apm = optObject(input, "automatic_payment_methods");
  if (!apm) return hasTypes ? null : { enabled: true };
  rejectUnknown(apm, ["enabled", "allow_redirects"], "automatic_payment_methods");
  const enabled = optBool(apm, "enabled", "automatic_payment_methods") ?? false;
  const allowRedirects = optEnum(apm, "allow_redirects", ["always", "never"] as const, "automatic_payment_methods");
  return allowRedirects ? { enabled, allow_redirects: allowRedirects } : { enabled };
}

function runConfirmation(call: ApiCall, intent: PaymentIntent, returnUrl: string | null | undefined): void {
  assertConfirmable(intent);
  const paymentMethod = intent.payment_method;
  if (!paymentMethod) throw missingParam("payment_method");
  checkRedirectRule(intent, returnUrl);
  const outcome = outcomeForPaymentMethod(paymentMethod);
  if (!outcome) throw invalidParam("payment_method", `No such PaymentMethod: '${paymentMethod}'`, "resource_missing");
  const error = confirmPaymentIntent(call.ctx, intent, paymentMethod, outcome, call.origin);
  if (error) throw cardError(error, intent);
}

function create(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, CREATE_KEYS);
  const amount = reqInt(input, "amount", "", 1);
  const currency = reqCurrency(input, "currency");
  if (amount < minimumCharge(currency)) {
    throw invalidParam("amount", `Amount must be at least ${formatMinor(minimumCharge(currency), currency)} ${currency}`, "amount_too_small");
  }
  const types = readAllowedMethods(input);
  const paymentMethod = optString(input, "payment_method");
  if (paymentMethod) checkPaymentMethod(paymentMethod);
  const transferData = readTransferData(call);
  const fee = optInt(input, "application_fee_amount", "", 0) ?? null;
  if (fee !== null && !transferData) {
    throw invalidParam("application_fee_amount", "An application fee needs a destination payment: set transfer_data[destination].");
  }
  if (fee !== null && fee > amount) throw invalidParam("application_fee_amount", "The application fee cannot exceed the amount.");
  const confirm = optBool(input, "confirm") ?? false;
  const returnUrl = optUrl(input, "return_url");
  if (optBool(input, "off_session") !== undefined && !confirm) {
    throw invalidParam("off_session", "off_session can only be set when confirm=true.");
  }
  optString(input, "statement_descriptor_suffix");
  const intent = newPaymentIntent(
    ctx,
    {
      allowed_payment_method_types: types ?? null,
      amount,
      currency,
      application_fee_amount: fee,
      automatic_payment_methods: readAutomaticPaymentMethods(input, types !== undefined),
      capture_method: optEnum(input, "capture_method", CAPTURE_METHODS) ?? "automatic",
      description: optString(input, "description") ?? null,
      metadata: applyMetadata({}, optMetadata(input)),
      payment_method: paymentMethod ?? null,
      payment_method_types: ["card"],
      receipt_email: optString(input, "receipt_email") ?? null,
      transfer_data: transferData,
      transfer_group: optString(input, "transfer_group") ?? null,
    },
    call.origin,
  );
  if (returnUrl) intent.return_url = returnUrl;
  if (confirm) runConfirmation(call, intent, returnUrl);
  return expandObject(ctx.store.state, intent, expandPaths(input));
}

function retrieve(call: ApiCall): unknown {
  rejectUnknown(call.input, ["client_secret", "expand"]);
  return expandObject(call.ctx.store.state, findIntent(call), expandPaths(call.input));
}

function update(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, ["metadata", "description", "payment_method", "receipt_email", "transfer_group", "expand"]);
  const intent = findIntent(call);
  const before = structuredClone(intent);
  const paymentMethod = optString(input, "payment_method");
  if (paymentMethod) {
    checkPaymentMethod(paymentMethod);
    intent.payment_method = paymentMethod;
    if (intent.status === "requires_payment_method") intent.status = "requires_confirmation";
  }
  intent.metadata = applyMetadata(intent.metadata, optMetadata(input));
  intent.description = optString(input, "description") ?? intent.description;
  intent.receipt_email = optString(input, "receipt_email") ?? intent.receipt_email;
  intent.transfer_group = optString(input, "transfer_group") ?? intent.transfer_group;
  ctx.store.changed();
  const previous = changedFields(before, intent);
  if (Object.keys(previous).length > 0) emitEvent(ctx, call.origin, "payment_intent.updated", intent, previous);
  return expandObject(ctx.store.state, intent, expandPaths(input));
}

function confirm(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, ["payment_method", "return_url", "capture_method", "off_session", "receipt_email", "allowed_payment_method_types", "expand"]);
  const intent = findIntent(call);
  assertConfirmable(intent);
  const paymentMethod = optString(input, "payment_method");
  if (paymentMethod) {
    checkPaymentMethod(paymentMethod);
    intent.payment_method = paymentMethod;
  }
  const captureMethod = optEnum(input, "capture_method", CAPTURE_METHODS);
  if (captureMethod) intent.capture_method = captureMethod;
  const types = readAllowedMethods(input);
  if (types) {
    intent.allowed_payment_method_types = types;
    intent.automatic_payment_methods = null;
  }
  const returnUrl = optUrl(input, "return_url") ?? intent.return_url;
  runConfirmation(call, intent, returnUrl);
  return expandObject(ctx.store.state, intent, expandPaths(input));
}

function capture(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, ["amount_to_capture", "application_fee_amount", "metadata", "final_capture", "expand"]);
  const intent = findIntent(call);
  const metadata = optMetadata(input);
  optBool(input, "final_capture");
  capturePaymentIntent(
    ctx,
    intent,
    {
      amountToCapture: optInt(input, "amount_to_capture", "", 1),
      applicationFeeAmount: optInt(input, "application_fee_amount", "", 0),
      metadata: metadata === undefined ? undefined : applyMetadata(intent.metadata, metadata),
    },
    call.origin,
  );
  return expandObject(ctx.store.state, intent, expandPaths(input));
}

function cancel(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, ["cancellation_reason", "expand"]);
  const intent = findIntent(call);
  const reason = optEnum(input, "cancellation_reason", ["duplicate", "fraudulent", "requested_by_customer", "abandoned"] as const);
  cancelPaymentIntent(ctx, intent, reason ?? null, call.origin);
  return expandObject(ctx.store.state, intent, expandPaths(input));
}

function list(call: ApiCall): unknown {
  rejectUnknown(call.input, [...LIST_PARAMS]);
  const page = paginate(Object.values(call.ctx.store.state.paymentIntents), call.input, "/v1/payment_intents");
  return expandObject(call.ctx.store.state, page, expandPaths(call.input));
}

export const paymentIntentRoutes: Route[] = [
  { method: "POST", pattern: "/v1/payment_intents", handler: create },
  { method: "GET", pattern: "/v1/payment_intents", handler: list },
  { method: "GET", pattern: "/v1/payment_intents/:id", handler: retrieve },
  { method: "POST", pattern: "/v1/payment_intents/:id", handler: update },
  { method: "POST", pattern: "/v1/payment_intents/:id/confirm", handler: confirm },
  { method: "POST", pattern: "/v1/payment_intents/:id/capture", handler: capture },
  { method: "POST", pattern: "/v1/payment_intents/:id/cancel", handler: cancel },
];
