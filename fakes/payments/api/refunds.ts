import { invalidParam, missingParam, noSuch } from "../api-error";
import { refundCharge } from "../core/refunds";
import { expandObject } from "../expand";
import { LIST_PARAMS, paginate } from "../list";
import { applyMetadata, expandPaths, optEnum, optInt, optMetadata, optString, rejectUnknown } from "../params";
import type { ApiCall, Route } from "../router";
import type { Charge } from "../types";

function chargeFor(call: ApiCall): Charge {
  const { state } = call.ctx.store;
  const chargeId = optString(call.input, "charge");
  const intentId = optString(call.input, "payment_intent");
  if (chargeId && intentId) throw invalidParam("charge", "Pass either charge or payment_intent, not both.");
  if (chargeId) {
    const charge = state.charges[chargeId];
    if (!charge) throw invalidParam("charge", `No such charge: '${chargeId}'`, "resource_missing");
    return charge;
  }
  if (!intentId) throw missingParam("charge");
  const intent = state.paymentIntents[intentId];
  if (!intent) throw invalidParam("payment_intent", `No such payment_intent: '${intentId}'`, "resource_missing");
  const charge = intent.latest_charge ? state.charges[intent.latest_charge] : undefined;
  if (!charge || intent.status !== "succeeded") {
    throw invalidParam(
      "payment_intent",
      `This PaymentIntent (${intent.id}) does not have a successful charge to refund.`,
      "charge_not_refundable",
    );
  }
  return charge;
}

function create(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, ["charge", "payment_intent", "amount", "reason", "metadata", "expand"]);
  const charge = chargeFor(call);
  const refund = refundCharge(
    ctx,
    charge,
    {
      amount: optInt(input, "amount", "", 1),
      reason: optEnum(input, "reason", ["duplicate", "fraudulent", "requested_by_customer"] as const) ?? null,
      metadata: applyMetadata({}, optMetadata(input)),
    },
    call.origin,
  );
  return expandObject(ctx.store.state, refund, expandPaths(input));
}

function retrieve(call: ApiCall): unknown {
  const id = call.params.id ?? "";
  const refund = call.ctx.store.state.refunds[id];
  if (!refund) throw noSuch("refund", id, "refund");
  return expandObject(call.ctx.store.state, refund, expandPaths(call.input));
}

function list(call: ApiCall): unknown {
  rejectUnknown(call.input, [...LIST_PARAMS, "charge", "payment_intent"]);
  const chargeId = optString(call.input, "charge");
  const intentId = optString(call.input, "payment_intent");
  const refunds = Object.values(call.ctx.store.state.refunds).filter(
    (r) => (!chargeId || r.charge === chargeId) && (!intentId || r.payment_intent === intentId),
  );
  return expandObject(call.ctx.store.state, paginate(refunds, call.input, "/v1/refunds"), expandPaths(call.input));
}

export const refundRoutes: Route[] = [
  { method: "POST", pattern: "/v1/refunds", handler: create },
  { method: "GET", pattern: "/v1/refunds", handler: list },
  { method: "GET", pattern: "/v1/refunds/:id", handler: retrieve },
];
