import { invalidParam, missingParam, noSuch, unexpectedState } from "../api-error";
import { expireSession } from "../core/checkout";
import { assertCanReceive } from "../core/transfers";
import { expandObject } from "../expand";
import { isFormObject } from "../form-body";
import { newId } from "../ids";
import { LIST_PARAMS, paginate } from "../list";
import { formatMinor, minimumCharge } from "../money";
import {
  applyMetadata,
  expandPaths,
  optArray,
  optCurrency,
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
import type { CheckoutSession, LineItem, PaymentIntentData } from "../types";

const CREATE_KEYS = [
  "mode", "line_items", "customer_email", "client_reference_id", "metadata", "success_url", "cancel_url",
  "expires_at", "payment_intent_data", "allowed_payment_method_types", "locale", "submit_type",
  "billing_address_collection", "ui_mode", "expand",
];
const INTENT_DATA_KEYS = [
  "metadata", "transfer_group", "capture_method", "application_fee_amount", "transfer_data", "description", "receipt_email",
];

// The provider's documented window for `expires_at`: 30 minutes to 24 hours after creation.
const MIN_EXPIRY_SECONDS = 30 * 60;
const MAX_EXPIRY_SECONDS = 24 * 60 * 60;
const MAX_LINE_ITEMS = 100;

function readLineItems(call: ApiCall): LineItem[] {
  const raw = optArray(call.input, "line_items");
  if (!raw || raw.length === 0) throw missingParam("line_items");
  if (raw.length > MAX_LINE_ITEMS) throw invalidParam("line_items", `You may pass at most ${MAX_LINE_ITEMS} line items.`);
  return raw.map((entry, index) => {
    const prefix = `line_items[${index}]`;
    if (!isFormObject(entry)) throw invalidParam(prefix, "Invalid object");
    rejectUnknown(entry, ["price_data", "price", "quantity", "metadata"], prefix);
    const priceId = optString(entry, "price", prefix);
    if (priceId) throw invalidParam(`${prefix}[price]`, `No such price: '${priceId}'`, "resource_missing");
    const priceData = optObject(entry, "price_data", prefix);
    if (!priceData) throw missingParam(`${prefix}[price_data]`);
    const pricePrefix = `${prefix}[price_data]`;
    rejectUnknown(priceData, ["currency", "unit_amount", "product_data", "tax_behavior"], pricePrefix);
    const currency = reqCurrency(priceData, "currency", pricePrefix);
    const unitAmount = reqInt(priceData, "unit_amount", pricePrefix, 0);
    const productData = optObject(priceData, "product_data", pricePrefix);
    if (!productData) throw missingParam(`${pricePrefix}[product_data]`);
    const productPrefix = `${pricePrefix}[product_data]`;
    rejectUnknown(productData, ["name", "description", "images", "metadata"], productPrefix);
    const name = reqString(productData, "name", productPrefix);
    const quantity = reqInt(entry, "quantity", prefix, 1);
    const total = unitAmount * quantity;
    return {
      id: newId("li"),
      object: "item",
      amount_discount: 0,
      amount_subtotal: total,
      amount_tax: 0,
      amount_total: total,
      currency,
      description: name,
      quantity,
      price: {
        id: newId("price"),
        object: "price",
        active: false,
        currency,
        unit_amount: unitAmount,
        product: newId("prod", 14),
        type: "one_time",
        livemode: false,
        metadata: {},
      },
    };
  });
}

function readIntentData(call: ApiCall): PaymentIntentData {
  const prefix = "payment_intent_data";
  const data = optObject(call.input, prefix) ?? {};
  rejectUnknown(data, INTENT_DATA_KEYS, prefix);
  const transferData = optObject(data, "transfer_data", prefix);
  let transfer: PaymentIntentData["transfer_data"] = null;
  if (transferData) {
    const tdPrefix = `${prefix}[transfer_data]`;
    rejectUnknown(transferData, ["destination", "amount"], tdPrefix);
    const destination = reqString(transferData, "destination", tdPrefix);
    assertCanReceive(call.ctx.store.state.accounts[destination], destination, `${tdPrefix}[destination]`);
    const amount = optInt(transferData, "amount", tdPrefix, 1);
    transfer = amount === undefined ? { destination } : { destination, amount };
  }
  const fee = optInt(data, "application_fee_amount", prefix, 0) ?? null;
  if (fee !== null && !transfer) {
    throw invalidParam(
      `${prefix}[application_fee_amount]`,
      "An application fee needs a destination payment: set payment_intent_data[transfer_data][destination].",
    );
  }
  return {
    metadata: applyMetadata({}, optMetadata(data, "metadata", prefix)),
    transfer_group: optString(data, "transfer_group", prefix) ?? null,
    capture_method: optEnum(data, "capture_method", ["automatic", "automatic_async", "manual"] as const, prefix) ?? "automatic",
    application_fee_amount: fee,
    transfer_data: transfer,
    description: optString(data, "description", prefix) ?? null,
    receipt_email: optString(data, "receipt_email", prefix) ?? null,
  };
}

function create(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, CREATE_KEYS);
  const mode = optEnum(input, "mode", ["payment", "setup", "subscription"] as const);
  if (!mode) throw missingParam("mode");
  if (mode !== "payment") throw invalidParam("mode", `The local payments fake supports only mode=payment, not ${mode}.`);
  optEnum(input, "ui_mode", ["hosted_page"] as const);
  const methods = readAllowedMethods(input);
  const successUrl = optUrl(input, "success_url");
  if (!successUrl) throw missingParam("success_url");
  const cancelUrl = optUrl(input, "cancel_url") ?? null;
  const lineItems = readLineItems(call);
  const currency = lineItems[0]?.currency ?? "usd";
  if (lineItems.some((item) => item.currency !== currency)) {
    throw invalidParam("line_items", "All line items must use the same currency.");
  }
  const amountTotal = lineItems.reduce((sum, item) => sum + item.amount_total, 0);
  if (amountTotal < minimumCharge(currency)) {
    throw invalidParam(
      "line_items",
      `The Checkout Session's total amount due must add up to at least ${formatMinor(minimumCharge(currency), currency)}.`,
      "amount_too_small",
    );
  }
  const created = ctx.clock.now();
  const expiresAt = optInt(input, "expires_at") ?? created + MAX_EXPIRY_SECONDS;
  if (expiresAt < created + MIN_EXPIRY_SECONDS || expiresAt > created + MAX_EXPIRY_SECONDS) {
    throw invalidParam(
      "expires_at",
      "The `expires_at` timestamp must be at least 30 minutes and at most 24 hours after the Checkout Session is created.",
    );
  }
  const email = optString(input, "customer_email") ?? null;
  if (email !== null && !/^[^\s@]+@[^\s@]+$/.test(email)) throw invalidParam("customer_email", `Invalid email address: ${email}`, "email_invalid");
  const reference = optString(input, "client_reference_id") ?? null;
  if (reference !== null && reference.length > 200) {
    throw invalidParam("client_reference_id", "client_reference_id can be at most 200 characters long.");
  }
  optEnum(input, "submit_type", ["auto", "pay", "book", "donate"] as const);
  optEnum(input, "billing_address_collection", ["auto", "required"] as const);
  optCurrency(input, "currency");
  const intentData = readIntentData(call);
  const id = newId("cs_test", 58);
  const session: CheckoutSession = {
    id,
    object: "checkout.session",
    allowed_payment_method_types: methods ?? null,
    amount_subtotal: amountTotal,
    amount_total: amountTotal,
    cancel_url: cancelUrl,
    client_reference_id: reference,
    created,
    currency,
    customer: null,
    customer_details: null,
    customer_email: email,
    expires_at: expiresAt,
    livemode: false,
    metadata: applyMetadata({}, optMetadata(input)),
    mode: "payment",
    payment_intent: null,
    payment_method_types: ["card"],
    payment_status: "unpaid",
    status: "open",
    success_url: successUrl,
    ui_mode: "hosted_page",
    url: `${ctx.publicUrl}/pay/${id}`,
  };
  const { state } = ctx.store;
  state.checkoutSessions[id] = session;
  state.lineItems[id] = lineItems;
  state.sessionIntentData[id] = intentData;
  ctx.store.changed();
  return expandObject(state, session, expandPaths(input));
}

function findSession(call: ApiCall): CheckoutSession {
  const id = call.params.id ?? "";
  const session = call.ctx.store.state.checkoutSessions[id];
  if (!session) throw noSuch("checkout.session", id, "session");
  return session;
}

function retrieve(call: ApiCall): unknown {
  return expandObject(call.ctx.store.state, findSession(call), expandPaths(call.input));
}

function expire(call: ApiCall): unknown {
  rejectUnknown(call.input, ["expand"]);
  const session = findSession(call);
  if (session.status !== "open") {
    // The code is the fake's own; the provider's exact code for this case is not known here.
    throw unexpectedState("checkout_session", `Only Checkout Sessions with a status in ["open"] can be expired; this one is ${session.status}.`);
  }
  expireSession(call.ctx, session, call.origin);
  return expandObject(call.ctx.store.state, session, expandPaths(call.input));
}

function list(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, [...LIST_PARAMS, "payment_intent", "status"]);
  const paymentIntent = optString(input, "payment_intent");
  const status = optEnum(input, "status", ["open", "complete", "expired"] as const);
  const sessions = Object.values(ctx.store.state.checkoutSessions).filter(
    (s) => (!paymentIntent || s.payment_intent === paymentIntent) && (!status || s.status === status),
  );
  const page = paginate(sessions, input, "/v1/checkout/sessions");
  return expandObject(ctx.store.state, page, expandPaths(input));
}

function listLineItems(call: ApiCall): unknown {
  const session = findSession(call);
  const items = call.ctx.store.state.lineItems[session.id] ?? [];
  return { object: "list", data: items, has_more: false, url: `/v1/checkout/sessions/${session.id}/line_items` };
}

export const checkoutSessionRoutes: Route[] = [
  { method: "POST", pattern: "/v1/checkout/sessions", handler: create },
  { method: "GET", pattern: "/v1/checkout/sessions", handler: list },
  { method: "GET", pattern: "/v1/checkout/sessions/:id", handler: retrieve },
  { method: "POST", pattern: "/v1/checkout/sessions/:id/expire", handler: expire },
  { method: "GET", pattern: "/v1/checkout/sessions/:id/line_items", handler: listLineItems },
];
