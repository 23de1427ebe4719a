import { noSuch } from "../api-error";
import { expandObject } from "../expand";
import { LIST_PARAMS, paginate } from "../list";
import { expandPaths, optString, rejectUnknown } from "../params";
import type { ApiCall, Route } from "../router";

function retrieve(call: ApiCall): unknown {
  const id = call.params.id ?? "";
  const charge = call.ctx.store.state.charges[id];
  if (!charge) throw noSuch("charge", id, "charge");
  return expandObject(call.ctx.store.state, charge, expandPaths(call.input));
}

function list(call: ApiCall): unknown {
  rejectUnknown(call.input, [...LIST_PARAMS, "payment_intent", "transfer_group"]);
  const paymentIntent = optString(call.input, "payment_intent");
  const transferGroup = optString(call.input, "transfer_group");
  const charges = Object.values(call.ctx.store.state.charges).filter(
    (c) => (!paymentIntent || c.payment_intent === paymentIntent) && (!transferGroup || c.transfer_group === transferGroup),
  );
  return expandObject(call.ctx.store.state, paginate(charges, call.input, "/v1/charges"), expandPaths(call.input));
}

export const chargeRoutes: Route[] = [
  { method: "GET", pattern: "/v1/charges", handler: list },
  { method: "GET", pattern: "/v1/charges/:id", handler: retrieve },
];
