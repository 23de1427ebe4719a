// Moving money from the platform to a connected account, and back (reversals).
import { ApiError, invalidParam } from "../api-error";
import { emitEvent, changedFields, type FakeContext, type Origin } from "../context";
import { newId } from "../ids";
import { formatMinor } from "../money";
import type { Account, Transfer, TransferReversal } from "../types";
import { availableBalance } from "./balance";

export interface TransferInput {
  amount: number;
  currency: string;
  destination: string;
  transferGroup: string | null;
  sourceTransaction: string | null;
  metadata: Record<string, string>;
  description: string | null;
}

/** A connected account may receive money only once its transfers capability is active. */
export function assertCanReceive(account: Account | undefined, destination: string, param: string): Account {
  if (!account) throw invalidParam(param, `No such destination: '${destination}'`, "resource_missing");
  if (account.capabilities.transfers !== "active" || !account.payouts_enabled) {
    throw invalidParam(
      param,
      "Your destination account needs to have at least one of the following capabilities enabled: transfers.",
      "insufficient_capabilities_for_transfer",
    );
  }
  return account;
}

export function createTransfer(ctx: FakeContext, input: TransferInput, origin: Origin): Transfer {
  const { state } = ctx.store;
  assertCanReceive(state.accounts[input.destination], input.destination, "destination");
  if (input.sourceTransaction) {
    const charge = state.charges[input.sourceTransaction];
    if (!charge) {
      throw invalidParam("source_transaction", `No such charge: '${input.sourceTransaction}'`, "resource_missing");
    }
    if (charge.status !== "succeeded" || !charge.captured) {
      throw invalidParam("source_transaction", "The source transaction must be a captured, successful charge.");
    }
    if (charge.currency !== input.currency) {
      throw invalidParam("currency", `The currency of the transfer (${input.currency}) must match the source charge (${charge.currency}).`);
    }
    // A transfer funded by a charge may not move more than that charge still holds.
    const alreadySent = Object.values(state.transfers)
      .filter((t) => t.source_transaction === charge.id)
      .reduce((sum, t) => sum + t.amount - t.amount_reversed, 0);
    const room = charge.amount_captured - charge.amount_refunded - alreadySent;
    if (input.amount > room) {
      throw invalidParam(
        "amount",
        `The transfer amount (${formatMinor(input.amount, input.currency)}) exceeds what is left on the source charge (${formatMinor(Math.max(room, 0), input.currency)}).`,
        "amount_too_large",
      );
    }
  } else {
    const available = availableBalance(state).get(input.currency) ?? 0;
    if (input.amount > available) {
      throw new ApiError(400, "invalid_request_error", "You have insufficient available funds in your balance.", "balance_insufficient", "amount");
    }
  }
  const id = newId("tr");
  const transfer: Transfer = {
    id,
    object: "transfer",
    amount: input.amount,
    amount_reversed: 0,
    balance_transaction: newId("txn"),
    created: ctx.clock.now(),
    currency: input.currency,
    description: input.description,
    destination: input.destination,
    destination_payment: newId("py"),
    livemode: false,
    metadata: input.metadata,
    reversals: { object: "list", data: [], has_more: false, total_count: 0, url: `/v1/transfers/${id}/reversals` },
    reversed: false,
    source_transaction: input.sourceTransaction,
    source_type: "card",
    transfer_group: input.transferGroup,
  };
  state.transfers[id] = transfer;
  ctx.store.changed();
  emitEvent(ctx, origin, "transfer.created", transfer);
  return transfer;
}

export function reverseTransfer(
  ctx: FakeContext,
  transfer: Transfer,
  input: { amount?: number; metadata: Record<string, string> },
  origin: Origin,
): TransferReversal {
  const remaining = transfer.amount - transfer.amount_reversed;
  if (remaining === 0) {
    throw invalidParam("amount", `Transfer ${transfer.id} has already been fully reversed.`, "transfer_already_reversed");
  }
  const amount = input.amount ?? remaining;
  if (amount < 1 || amount > remaining) {
    throw invalidParam(
      "amount",
      `Reversal amount (${formatMinor(amount, transfer.currency)}) is greater than the amount left on the transfer (${formatMinor(remaining, transfer.currency)}).`,
      "amount_too_large",
    );
  }
  const before = structuredClone(transfer);
  const reversal: TransferReversal = {
    id: newId("trr"),
    object: "transfer_reversal",
    amount,
    balance_transaction: newId("txn"),
    created: ctx.clock.now(),
    currency: transfer.currency,
    metadata: input.metadata,
    transfer: transfer.id,
  };
  transfer.amount_reversed += amount;
  transfer.reversed = transfer.amount_reversed === transfer.amount;
  transfer.reversals = {
    ...transfer.reversals,
    data: [reversal, ...transfer.reversals.data],
    total_count: (transfer.reversals.total_count ?? 0) + 1,
  };
  ctx.store.changed();
  emitEvent(ctx, origin, "transfer.reversed", transfer, changedFields(before, transfer));
  return reversal;
}
