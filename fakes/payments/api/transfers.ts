import { noSuch } from "../api-error";
import { balanceObject } from "../core/balance";
import { createTransfer, reverseTransfer } from "../core/transfers";
import { expandObject } from "../expand";
import { LIST_PARAMS, paginate } from "../list";
import {
  applyMetadata,
  expandPaths,
  optInt,
  optMetadata,
  optString,
  rejectUnknown,
  reqCurrency,
  reqInt,
  reqString,
} from "../params";
import type { ApiCall, Route } from "../router";
import type { Transfer } from "../types";

function findTransfer(call: ApiCall): Transfer {
  const id = call.params.id ?? "";
  const transfer = call.ctx.store.state.transfers[id];
  if (!transfer) throw noSuch("transfer", id, "transfer");
  return transfer;
}

function create(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, ["amount", "currency", "destination", "transfer_group", "source_transaction", "metadata", "description", "expand"]);
  const transfer = createTransfer(
    ctx,
    {
      amount: reqInt(input, "amount", "", 1),
      currency: reqCurrency(input, "currency"),
      destination: reqString(input, "destination"),
      transferGroup: optString(input, "transfer_group") ?? null,
      sourceTransaction: optString(input, "source_transaction") ?? null,
      metadata: applyMetadata({}, optMetadata(input)),
      description: optString(input, "description") ?? null,
    },
    call.origin,
  );
  return expandObject(ctx.store.state, transfer, expandPaths(input));
}

function retrieve(call: ApiCall): unknown {
  return expandObject(call.ctx.store.state, findTransfer(call), expandPaths(call.input));
}

function list(call: ApiCall): unknown {
  rejectUnknown(call.input, [...LIST_PARAMS, "destination", "transfer_group"]);
  const destination = optString(call.input, "destination");
  const group = optString(call.input, "transfer_group");
  const transfers = Object.values(call.ctx.store.state.transfers).filter(
    (t) => (!destination || t.destination === destination) && (!group || t.transfer_group === group),
  );
  return expandObject(call.ctx.store.state, paginate(transfers, call.input, "/v1/transfers"), expandPaths(call.input));
}

function createReversal(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, ["amount", "metadata", "description", "refund_application_fee", "expand"]);
  const transfer = findTransfer(call);
  const reversal = reverseTransfer(
    ctx,
    transfer,
    { amount: optInt(input, "amount", "", 1), metadata: applyMetadata({}, optMetadata(input)) },
    call.origin,
  );
  return expandObject(ctx.store.state, reversal, expandPaths(input));
}

function listReversals(call: ApiCall): unknown {
  const transfer = findTransfer(call);
  const oldestFirst = [...transfer.reversals.data].reverse();
  return paginate(oldestFirst, call.input, `/v1/transfers/${transfer.id}/reversals`);
}

function balance(call: ApiCall): unknown {
  return balanceObject(call.ctx.store.state);
}

export const transferRoutes: Route[] = [
  { method: "POST", pattern: "/v1/transfers", handler: create },
  { method: "GET", pattern: "/v1/transfers", handler: list },
  { method: "GET", pattern: "/v1/transfers/:id", handler: retrieve },
  { method: "POST", pattern: "/v1/transfers/:id/reversals", handler: createReversal },
  { method: "GET", pattern: "/v1/transfers/:id/reversals", handler: listReversals },
  { method: "GET", pattern: "/v1/balance", handler: balance },
];
