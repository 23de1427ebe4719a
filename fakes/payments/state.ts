import type {
  Account,
  AccountLinkRecord,
  Charge,
  CheckoutSession,
  LineItem,
  PaymentIntent,
  PaymentIntentData,
  Refund,
  ApiEvent,
  Transfer,
} from "./types";

export interface IdempotencyEntry {
  method: string;
  path: string;
  body: string;
  status: number;
  response: string;
  created: number;
}

export interface WebhookEndpointConfig {
  url: string;
  secret: string;
}

/** Everything the fake knows; plain JSON so it can be written to the store file as is. */
export interface FakeState {
  version: 1;
  accounts: Record<string, Account>;
  accountLinks: Record<string, AccountLinkRecord>;
  checkoutSessions: Record<string, CheckoutSession>;
  lineItems: Record<string, LineItem[]>;
  // What the session will put on the payment intent it creates once the buyer pays.
  sessionIntentData: Record<string, PaymentIntentData>;
  paymentIntents: Record<string, PaymentIntent>;
  charges: Record<string, Charge>;
  refunds: Record<string, Refund>;
  transfers: Record<string, Transfer>;
  events: Record<string, ApiEvent>;
  idempotency: Record<string, IdempotencyEntry>;
  // Endpoints added at runtime; those passed as options are not stored.
  webhookEndpoints: WebhookEndpointConfig[];
  clockOffsetSeconds: number;
}

export function emptyState(): FakeState {
  return {
    version: 1,
    accounts: {},
    accountLinks: {},
    checkoutSessions: {},
    lineItems: {},
    sessionIntentData: {},
    paymentIntents: {},
    charges: {},
    refunds: {},
    transfers: {},
    events: {},
    idempotency: {},
    webhookEndpoints: [],
    clockOffsetSeconds: 0,
  };
}

/** Finds any stored object by its id prefix, for `expand[]`. */
export function findById(state: FakeState, id: string): unknown {
  const prefix = id.slice(0, id.indexOf("_") + 1);
  switch (prefix) {
    case "acct_":
      return state.accounts[id];
    case "cs_":
      return state.checkoutSessions[id];
    case "pi_":
      return state.paymentIntents[id];
    case "ch_":
      return state.charges[id];
    case "re_":
      return state.refunds[id];
    case "tr_":
      return state.transfers[id];
    case "evt_":
      return state.events[id];
    default:
      return undefined;
  }
}
